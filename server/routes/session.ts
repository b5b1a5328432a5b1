import { Router } from 'express';
import { CurrentClubBodySchema, SignInBodySchema, type SessionInfo } from '@shared/schemas/auth';
import type { Deps } from '../deps';
import { AppError, parseInput } from '../errors';
import { csrfToken } from '../middleware/csrf';
import { createSignInLimiter, signInLocked } from '../middleware/sign-in-limit';
import { signIn, signOut } from '../middleware/session';
import { requireUser } from '../middleware/auth';
import { loadSessionUser, verifyCredentials } from '../services/auth';
import { rememberCurrentClub } from '../services/memberships';

/** Sign-in, sign-out and "who am I" (with the CSRF token the client sends back). */
export function sessionRouter({ db, config }: Deps): Router {
  const router = Router();
  const limiter = createSignInLimiter(db, config);

  router.get('/', async (req, res) => {
    const user = req.session.userId ? await loadSessionUser(db, req.session.userId) : null;
    const body: SessionInfo = { user, csrfToken: csrfToken(req, res, config) };
    res.json(body);
  });

  // Failed sign-ins are counted per account and per client address; successes are not.
  router.post('/', async (req, res) => {
    const input = parseInput(SignInBodySchema, req.body);
    const address = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    const lock = await limiter.begin(input.email, address);
    if (lock) {
      res.set('Retry-After', String(lock.retryAfterSeconds));
      throw signInLocked();
    }
    const userId = await verifyCredentials(db, input.email, input.password);
    if (!userId) throw new AppError('unauthenticated', 'E-mail or password is wrong.');
    await limiter.succeeded(input.email, address);
    await signIn(req, userId);
    const body: SessionInfo = { user: await loadSessionUser(db, userId), csrfToken: csrfToken(req, res, config) };
    res.json(body);
  });

  // The club the person is working in, so the next sign-in (on any device) opens it.
  router.put('/club', requireUser, async (req, res) => {
    const body = parseInput(CurrentClubBodySchema, req.body);
    await rememberCurrentClub(db, req.session.userId!, body.clubId);
    res.status(204).end();
  });

  router.delete('/', async (req, res) => {
    await signOut(req);
    res.clearCookie('tillwell.sid');
    res.status(204).end();
  });

  return router;
}
