import crypto from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import { AppError } from '../errors';
import type { Db } from '../db/knex';

/** A key still "being handled" after this long belongs to a request that died (a crash): it may be claimed again. */
export const ABANDONED_AFTER_MS = 2 * 60 * 1000;
/** Remembered answers are kept a week: a phone's offline queue may send an entry days after it was made. */
export const KEEP_ANSWERS_MS = 7 * 24 * 60 * 60 * 1000;

/** Forgets remembered answers older than a week; run by the deadline sweep job. */
export async function pruneIdempotencyKeys(db: Db, now: Date): Promise<number> {
  return db('idempotency_keys').where('created_at', '<', new Date(now.getTime() - KEEP_ANSWERS_MS)).delete();
}

/** What a client may send as an Idempotency-Key: 1 to 200 visible ASCII characters (a UUID fits). */
const KEY = /^[\x21-\x7e]{1,200}$/;

/** JSON with object keys sorted, so the same body always hashes the same. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

function replay(res: Response, row: { response_status: number; response_type: string | null; response_body: string | null }) {
  res.status(row.response_status).set('Idempotent-Replayed', 'true');
  if (row.response_type) res.set('Content-Type', row.response_type);
  res.end(row.response_body ?? undefined);
}

/**
 * Makes a creating request safe to retry. A request carrying an `Idempotency-Key` header is
 * remembered (per signed-in person, route and key) with its answer; the same key on the same
 * route again gets that first answer back without doing the work twice, and with a different
 * body a 409. The unique index on the key decides races: of two requests sent at once with one
 * key, one does the work and the other hears it is still being handled (409). Server errors (5xx)
 * and 429s are not remembered, so a retry after them runs again. Place it after the route's
 * authorisation; requests without the header pass straight through.
 */
export function idempotent(db: Db): RequestHandler {
  return async (req, res, next) => {
    const key = req.get('Idempotency-Key');
    if (key === undefined) return next();
    if (!KEY.test(key)) {
      return next(new AppError('validation_failed', 'The Idempotency-Key header must be 1 to 200 visible characters, such as a UUID.'));
    }
    const userId = req.session.userId;
    if (!userId) return next(new AppError('unauthenticated', 'Please sign in.'));
    const where = { scope: `user:${userId}`, route: `${req.method} ${req.baseUrl}${req.path}`, key };
    const requestHash = crypto.createHash('sha256').update(canonical(req.body)).digest('hex');

    const claim = () =>
      db('idempotency_keys')
        .insert({ ...where, club_id: req.clubId ?? null, request_hash: requestHash })
        .onConflict(['scope', 'route', 'key'])
        .ignore()
        .returning('id');
    let inserted = await claim();
    if (inserted.length === 0) {
      // A claim left unanswered by a request that died is given up, once, so a retry can proceed.
      const abandoned = await db('idempotency_keys')
        .where(where)
        .whereNull('response_status')
        .where('created_at', '<', new Date(Date.now() - ABANDONED_AFTER_MS))
        .delete();
      if (abandoned > 0) inserted = await claim();
    }
    if (inserted.length === 0) {
      const row = await db('idempotency_keys').where(where).first();
      if (row && row.request_hash !== requestHash) {
        return next(new AppError('conflict', 'This Idempotency-Key was already used for a different request. Use a new key for a new request.'));
      }
      if (!row || row.response_status === null) {
        return next(new AppError('conflict', 'A request with this Idempotency-Key is still being handled. Try again in a moment.'));
      }
      return replay(res, row);
    }

    const id = inserted[0].id as number;
    const end = res.end.bind(res) as (...args: unknown[]) => Response;
    // The answer is stored before it is sent, so a retry that arrives after it finds it.
    res.end = ((...args: unknown[]) => {
      const [chunk] = args;
      const status = res.statusCode;
      const body = typeof chunk === 'string' ? chunk : Buffer.isBuffer(chunk) ? chunk.toString('utf8') : null;
      const type = res.get('Content-Type');
      const save =
        status >= 500 || status === 429
          ? db('idempotency_keys').where({ id }).delete()
          : db('idempotency_keys').where({ id }).update({ response_status: status, response_type: type ?? null, response_body: body });
      save.then(
        () => end(...args),
        (err: unknown) => {
          req.log?.error({ err, requestId: req.id }, 'could not store the idempotent response');
          end(...args);
        },
      );
      return res;
    }) as Response['end'];
    next();
  };
}
