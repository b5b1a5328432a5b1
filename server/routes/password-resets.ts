import { Router } from 'express';
import { PasswordResetBodySchema, PasswordResetCheckQuerySchema, PasswordResetRequestBodySchema } from '@shared/schemas/auth';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { authRateLimit } from '../middleware/rate-limit';
import { checkPasswordReset, completePasswordReset, requestPasswordReset } from '../services/password-resets';

/** Asking for a reset link and using it. */
export function passwordResetsRouter({ db, mailer, config }: Deps): Router {
  const router = Router();
  const limit = authRateLimit(db, 'password-resets', config.authRateLimit);

  router.post('/', limit, async (req, res) => {
    const { email } = parseInput(PasswordResetRequestBodySchema, req.body);
    // Sent in the background so the reply takes as long whether or not the address has an account.
    requestPasswordReset(db, mailer, { email, publicUrl: config.publicUrl }).catch((err) =>
      req.log.error({ err, requestId: req.id }, 'password reset e-mail failed'),
    );
    res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
  });

  router.get('/check', limit, async (req, res) => {
    const { token } = parseInput(PasswordResetCheckQuerySchema, req.query);
    res.json(await checkPasswordReset(db, { token }));
  });

  router.post('/complete', limit, async (req, res) => {
    const input = parseInput(PasswordResetBodySchema, req.body);
    await completePasswordReset(db, { ...input, bcryptCost: config.bcryptCost });
    res.status(204).end();
  });

  return router;
}
