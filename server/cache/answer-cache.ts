import type { Request, RequestHandler, Response } from 'express';
import { ByteLru } from './byte-lru';

interface Answer {
  stamp: string;
  at: number;
  body: Buffer;
  etag?: string;
  cacheControl?: string;
}

/**
 * Whole GET answers per person, kept in this server's memory and reused only while nothing in the
 * database has changed since they were built, and for at most `clockMs` (answers that also depend on
 * the clock: an offer's deadline passing, this week's shifts).
 *
 * The stamp is the database's transaction snapshot (`pg_current_snapshot()`), read in the session's own
 * query (session-store.ts), so a reused answer costs that one query. The snapshot moves whenever any
 * transaction on any server starts writing or commits, so a write anywhere is seen by the next read on
 * every server; the stamp is read before the answer is built, so an answer built from newer rows than its
 * stamp is at worst built again. Every write in the database empties the cache's use: it pays off where
 * reads outnumber writes, as on the map and the boards, and costs a lookup otherwise.
 *
 * Only 200 answers with a JSON body are kept, keyed by person and full URL: a reused answer is one the same
 * person had from the same rows, so the role checks it passed then still hold (roles are rows too).
 */
export class AnswerCache {
  private store: ByteLru<Answer>;
  /** Answers being built, by key and stamp: requests that ask meanwhile wait for the same one. */
  private building = new Map<string, Promise<Answer | undefined>>();
  hits = 0;
  misses = 0;

  constructor(
    maxBytes: number,
    private readonly clockMs = 1000,
    private readonly now: () => number = Date.now,
  ) {
    this.store = new ByteLru<Answer>(maxBytes);
  }

  get(key: string, stamp: string): Answer | undefined {
    return this.store.get(key, (e) => e.stamp === stamp && this.now() - e.at <= this.clockMs);
  }

  set(key: string, answer: Answer) {
    this.store.set(key, answer);
  }

  get size() {
    return this.store.size;
  }

  /**
   * Whether a good answer is old enough to be built again ahead of time: past three quarters of the
   * clock window, one request builds the next copy while the others are still answered from this one,
   * so the answer does not lapse under load with every waiting request queued behind one build.
   */
  private dueForRenewal(hit: Answer) {
    return this.now() - hit.at > this.clockMs * 0.75;
  }

  /** Middleware for the GET routes whose answers may be reused (mounted before their routers). */
  middleware(): RequestHandler {
    const reply = (req: Request, res: Response, hit: Answer) => {
      if (hit.cacheControl) res.setHeader('Cache-Control', hit.cacheControl);
      if (hit.etag) {
        res.setHeader('ETag', hit.etag);
        if (req.fresh) {
          res.status(304).end();
          return;
        }
      }
      res.type('application/json').send(hit.body);
    };
    return (req, res, next) => {
      const stamp = req.dbStamp;
      const userId = req.session?.userId;
      if (req.method !== 'GET' || !stamp || !userId) return next();
      const key = `${userId} ${req.originalUrl}`;
      const hit = this.get(key, stamp);
      const flight = `${key} ${stamp}`;
      const pending = this.building.get(flight);
      if (hit && (pending || !this.dueForRenewal(hit))) {
        this.hits += 1;
        return reply(req, res, hit);
      }
      if (pending) {
        // The same person's same read from the same rows is being built: wait for it, or build it
        // too if that one did not end in a 200.
        pending.then((answer) => (answer ? (this.hits++, reply(req, res, answer)) : next()), next);
        return;
      }
      this.misses += 1;
      const startedAt = this.now();
      let done!: (answer: Answer | undefined) => void;
      this.building.set(flight, new Promise((resolve) => (done = resolve)));
      const finish = (answer: Answer | undefined) => {
        if (this.building.has(flight)) {
          this.building.delete(flight);
          done(answer);
        }
      };
      res.on('close', () => finish(undefined));
      const send = res.send.bind(res);
      res.send = (body?: unknown) => {
        res.send = send;
        const type = String(res.getHeader('Content-Type') ?? '');
        if (res.statusCode === 200 && type.startsWith('application/json') && (typeof body === 'string' || Buffer.isBuffer(body))) {
          const answer: Answer = {
            stamp,
            at: startedAt,
            body: Buffer.isBuffer(body) ? body : Buffer.from(body),
            etag: res.getHeader('ETag') as string | undefined,
            cacheControl: res.getHeader('Cache-Control') as string | undefined,
          };
          this.set(key, answer);
          finish(answer);
        } else finish(undefined);
        return send(body);
      };
      next();
    };
  }
}
