import type { Response } from 'express';
import { notFound } from '../errors';
import type { Storage } from '../storage';

/**
 * Sends a stored upload with the type the database recorded for it, privately cacheable and never sniffed.
 * Express adds an ETag and answers a matching If-None-Match with 304. A row whose file is gone is a 404.
 */
export async function sendStoredFile(res: Response, storage: Storage, found: { key: string; mime: string }, what: string): Promise<void> {
  const object = await storage.get(found.key);
  if (!object) throw notFound(what);
  res.set({ 'Content-Type': found.mime, 'Cache-Control': 'private, max-age=3600', 'X-Content-Type-Options': 'nosniff' });
  res.send(object.bytes);
}
