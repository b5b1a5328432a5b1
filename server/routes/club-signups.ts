import { Router } from 'express';
import { ClubSignupBodySchema, ClubSignupTokenSchema, type ClubSignupResult } from '@shared/schemas/club-signups';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { csrfToken } from '../middleware/csrf';
import { authRateLimit, clientRateLimit } from '../middleware/rate-limit';
import { signIn } from '../middleware/session';
import { loadSessionUser } from '../services/auth';
import { checkClubSignup, confirmClubSignup, requestClubSignup } from '../services/club-signups';

/** Starting a club (public), mounted at /api/club-signups. */
export function clubSignupsRouter({ db, mailer, config }: Deps): Router {
  const router = Router();
  // The same per-address hourly count as the public application form, under a name of its own.
  const formLimit = clientRateLimit(db, {
    name: 'club-signups',
    windowMs: 60 * 60 * 1000,
    limit: config.applyRateLimit,
    message: 'Too many sign-ups from this connection. Try again in an hour.',
  });
  const linkLimit = authRateLimit(db, 'club-signup-links', config.authRateLimit);

  router.post('/', formLimit, async (req, res) => {
    const body = parseInput(ClubSignupBodySchema, req.body);
    // Awaited for every address alike: the work (hash, insert, mail) does not depend on an account existing.
    await requestClubSignup(db, mailer, { body, publicUrl: config.publicUrl, bcryptCost: config.bcryptCost });
    res.status(202).json({ message: 'Check your e-mail: we sent a link to confirm the address and start the club.' });
  });

  router.get('/check', linkLimit, async (req, res) => {
    const { token } = parseInput(ClubSignupTokenSchema, req.query);
    res.json(await checkClubSignup(db, { token }));
  });

  router.post('/confirm', linkLimit, async (req, res) => {
    const { token } = parseInput(ClubSignupTokenSchema, req.body);
    const made = await confirmClubSignup(db, { token });
    let body: ClubSignupResult;
    if (made.existingAccount) {
      body = { clubId: made.clubId, clubSlug: made.clubSlug, existingAccount: true, user: null, csrfToken: null };
    } else {
      await signIn(req, made.userId);
      body = { clubId: made.clubId, clubSlug: made.clubSlug, existingAccount: false, user: await loadSessionUser(db, made.userId), csrfToken: csrfToken(req, res, config) };
    }
    res.status(201).json(body);
  });

  return router;
}
