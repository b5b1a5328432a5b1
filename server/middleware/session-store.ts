import crypto from 'node:crypto';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Role } from '@shared/schemas/auth';

const MEMBERSHIPS = '__memberships';
const STAMP = '__stamp';

// The session row and the person's roles in every club in one query: the role check that follows
// on nearly every request then needs no query of its own. The transaction snapshot comes with it, as
// the stamp of the answers AnswerCache (server/cache/answer-cache.ts) reuses.
const GET_SQL = `
  select s.sess,
         coalesce((select json_object_agg(x.club_id, x.roles)
                     from (select m.club_id, array_agg(m.role order by m.role) as roles
                             from memberships m
                            where m.user_id = (s.sess->>'userId')::int
                            group by m.club_id) x), '{}'::json) as memberships,
         pg_current_snapshot()::text as stamp
    from session s
   where s.sid = $1 and s.expire >= now()`;

/** The session table keys sessions by a hash of their id, so a copy of the table signs no one in. */
export const sessionKey = (sid: string) => crypto.createHash('sha256').update(sid).digest('base64url');

/**
 * The PostgreSQL session store (connect-pg-simple), keyed by sessionKey(sid), whose read also brings the signed-in person's
 * memberships, left on req.memberships (club id → roles) for requireClubRole and requireRoleVia.
 * Read fresh with every request, so a role taken away counts from the next request on.
 */
export function createSessionStore(opts: { pool: pg.Pool; errorLog: (...args: unknown[]) => void }) {
  const PgStore = connectPgSimple(session);
  class SessionStore extends PgStore {
    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void) {
      // Named, so each pooled connection parses and plans it once (it runs on nearly every request).
      opts.pool.query({ name: 'tillwell-session-get', text: GET_SQL, values: [sessionKey(sid)] }).then(
        (r) => {
          const row = r.rows[0];
          if (!row) return fn(null, null);
          const sess = typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess;
          fn(null, { ...sess, [MEMBERSHIPS]: row.memberships, [STAMP]: row.stamp });
        },
        (err) => fn(err),
      );
    }

    override set(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void) {
      return super.set(sessionKey(sid), sess, fn);
    }

    override destroy(sid: string, fn?: (err?: unknown) => void) {
      return super.destroy(sessionKey(sid), fn);
    }

    override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void) {
      return super.touch(sessionKey(sid), sess, fn);
    }

    override createSession(req: Express.Request, sess: session.SessionData) {
      const bag = sess as unknown as Record<string, unknown>;
      req.memberships = (bag[MEMBERSHIPS] as Record<string, Role[]> | undefined) ?? undefined;
      req.dbStamp = bag[STAMP] as string | undefined;
      delete bag[MEMBERSHIPS];
      delete bag[STAMP];
      return super.createSession(req as never, sess);
    }
  }
  return new SessionStore({
    pool: opts.pool,
    tableName: 'session',
    pruneSessionInterval: 15 * 60,
    // No touch on every request: a signed-in session is refreshed at most once a day (refreshSession).
    disableTouch: true,
    errorLog: opts.errorLog,
  });
}
