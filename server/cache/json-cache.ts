import crypto from 'node:crypto';
import type { Request, Response } from 'express';
import { ByteLru } from './byte-lru';

interface Entry {
  stamp: string;
  body: Buffer;
  etag: string;
}

/**
 * Serialised JSON answers kept per key and stamp, in this server's memory. A stamp is a value the
 * database moves whenever the answer could change (e.g. sites.map_stamp), read by the request before
 * the answer is built: an entry is used only while the stamp is the same, so a write on any server is
 * seen by the next read everywhere, and an answer built from newer rows than its stamp is at worst
 * built again. Bounded by total bytes (ByteLru).
 */
export class JsonCache {
  private store: ByteLru<Entry>;

  constructor(maxBytes: number) {
    this.store = new ByteLru<Entry>(maxBytes);
  }

  get(key: string, stamp: string): Entry | undefined {
    return this.store.get(key, (e) => e.stamp === stamp);
  }

  set(key: string, stamp: string, value: unknown): Entry {
    const body = Buffer.from(JSON.stringify(value));
    const etag = `"${crypto.createHash('sha1').update(body).digest('base64url')}"`;
    const e = { stamp, body, etag };
    this.store.set(key, e);
    return e;
  }

  get size() {
    return this.store.size;
  }
}

/**
 * Answers from the cache when the stamp still matches, else builds, stores and sends the answer.
 * Sends the entry's ETag; a browser revalidating with it gets 304 and no body.
 */
export async function sendCachedJson(
  req: Request,
  res: Response,
  cache: JsonCache,
  key: string,
  stamp: unknown,
  build: () => Promise<unknown>,
): Promise<void> {
  const s = String(stamp);
  const entry = cache.get(key, s) ?? cache.set(key, s, await build());
  res.setHeader('ETag', entry.etag);
  res.setHeader('Cache-Control', 'private, no-cache');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  res.type('application/json').send(entry.body);
}
