import 'express-session';
import type { Logger } from 'pino';
import type { Role } from '@shared/schemas/auth';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
    csrfToken?: string;
    /** When the signed-in session was last written (ms), so it is refreshed once a day. */
    refreshedAt?: number;
  }
}

declare global {
  namespace Express {
    interface Request {
      clubId?: number;
      clubRoles?: Role[];
      /** The signed-in person's roles per club id, read with the session (see session-store.ts). */
      memberships?: Record<string, Role[]>;
      /** The database's transaction snapshot when the session was read: AnswerCache's stamp. */
      dbStamp?: string;
      /** The columns requireRoleVia's lookup selected for the record (its club_id, a cache stamp). */
      via?: Record<string, unknown>;
      /** The request's id (X-Request-Id), set by requestLog. */
      id?: string;
      /** A logger carrying the request id, made on first use. */
      log: Logger;
    }
  }
}
