import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { PasswordResetRequestBody } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';

const AcceptedSchema = z.object({ message: z.string() });

/** POST /api/password-resets: asks for a reset e-mail; the answer never says whether the address exists. */
export function requestPasswordReset(body: PasswordResetRequestBody): Promise<{ message: string }> {
  return apiFetch('/api/password-resets', { method: 'POST', body, schema: AcceptedSchema });
}

/** Mutation hook for the forgot-password form. */
export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
