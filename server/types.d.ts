import 'express-session';
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
    }
  }
}
