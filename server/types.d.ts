import 'express-session';
import type { Role } from '@shared/schemas/auth';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
    csrfToken?: string;
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
