import { useMutation } from '@tanstack/react-query';
import type { PasswordResetBody } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';

/** POST /api/password-resets/complete: sets a new password with the token from the e-mail. */
export function resetPassword(body: PasswordResetBody): Promise<undefined> {
  return apiFetch('/api/password-resets/complete', { method: 'POST', body });
}

/** Mutation hook for the reset-password form. */
export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
