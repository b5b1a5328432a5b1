import crypto from 'node:crypto';
import type { Request, Response } from 'express';

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
 * built again. Bounded by total bytes; the entry used least recently goes first.
 */
export class JsonCache {
  private entries = new Map<string, Entry>();
  private bytes = 0;

  constructor(private readonly maxBytes: number) {}

  get(key: string, stamp: string): Entry | undefined {
    const e = this.entries.get(key);
    if (!e) return undefined;
    if (e.stamp !== stamp) {
      this.drop(key);
      return undefined;
    }
    // Most recently used last: re-insert.
    this.entries.delete(key);
    this.entries.set(key, e);
    return e;
  }

  set(key: string, stamp: string, value: unknown): Entry {
    const body = Buffer.from(JSON.stringify(value));
    const etag = `"${crypto.createHash('sha1').update(body).digest('base64url')}"`;
    const e = { stamp, body, etag };
    this.drop(key);
    if (body.length <= this.maxBytes) {
      this.entries.set(key, e);
      this.bytes += body.length;
      for (const [k] of this.entries) {
        if (this.bytes <= this.maxBytes) break;
        this.drop(k);
      }
    }
    return e;
  }

  get size() {
    return this.entries.size;
  }

  private drop(key: string) {
    const e = this.entries.get(key);
    if (e) {
      this.bytes -= e.body.length;
      this.entries.delete(key);
    }
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
