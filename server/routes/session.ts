import { Router } from 'express';
import { SignInBodySchema, type SessionInfo } from '@shared/schemas/auth';
import type { Deps } from '../deps';
import { AppError, parseInput } from '../errors';
import { csrfToken } from '../middleware/csrf';
import { authRateLimit } from '../middleware/rate-limit';
import { signIn, signOut } from '../middleware/session';
import { loadSessionUser, verifyCredentials } from '../services/auth';

/** Sign-in, sign-out and "who am I" (with the CSRF token the client sends back). */
export function sessionRouter({ db, config }: Deps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const user = req.session.userId ? await loadSessionUser(db, req.session.userId) : null;
    const body: SessionInfo = { user, csrfToken: csrfToken(req) };
    res.json(body);
  });

  router.post('/', authRateLimit(config.authRateLimit), async (req, res) => {
    const input = parseInput(SignInBodySchema, req.body);
    const userId = await verifyCredentials(db, input.email, input.password);
    if (!userId) throw new AppError('unauthenticated', 'E-mail or password is wrong.');
    await signIn(req, userId);
    const body: SessionInfo = { user: await loadSessionUser(db, userId), csrfToken: csrfToken(req) };
    res.json(body);
  });

  router.delete('/', async (req, res) => {
    await signOut(req);
    res.clearCookie('tillwell.sid');
    res.status(204).end();
  });

  return router;
}
