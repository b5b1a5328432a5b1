import { queryOptions, useQuery } from '@tanstack/react-query';
import { PasswordResetCheckSchema, type PasswordResetCheck } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { authKeys } from './keys';

/** GET /api/password-resets/check: whether the e-mailed link still works, without using it. */
export function checkPasswordReset(token: string, signal?: AbortSignal): Promise<PasswordResetCheck> {
  return apiFetch(`/api/password-resets/check?token=${encodeURIComponent(token)}`, { schema: PasswordResetCheckSchema, signal });
}

/** Query options for one reset link's check; the token is the id. */
export function passwordResetCheckQueryOptions(token: string) {
  return queryOptions({
    queryKey: authKeys.passwordResetCheck(token),
    queryFn: ({ signal }) => checkPasswordReset(token, signal),
    retry: false,
  });
}

/** The check of the reset link being viewed; off until the token looks like one. */
export function usePasswordResetCheck(token: string, enabled: boolean) {
  return useQuery({ ...passwordResetCheckQueryOptions(token), enabled });
}
