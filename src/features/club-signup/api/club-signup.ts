import { useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import {
  ClubSignupCheckSchema,
  ClubSignupResultSchema,
  type ClubSignupBody,
  type ClubSignupCheck,
  type ClubSignupResult,
} from '@shared/schemas/club-signups';
import { apiFetch } from '@/lib/api/client';

const SentSchema = z.object({ message: z.string() });

/** POST /api/club-signups: records the sign-up and e-mails the link (the same answer for every address). */
export function requestClubSignup(body: ClubSignupBody): Promise<{ message: string }> {
  return apiFetch('/api/club-signups', { method: 'POST', body, schema: SentSchema });
}

export function useRequestClubSignup() {
  return useMutation({ mutationFn: requestClubSignup });
}

/** GET /api/club-signups/check: whether the link still works, without using it. */
export function checkClubSignup(token: string, signal?: AbortSignal): Promise<ClubSignupCheck> {
  return apiFetch(`/api/club-signups/check?token=${encodeURIComponent(token)}`, { schema: ClubSignupCheckSchema, signal });
}

export function useClubSignupCheck(token: string) {
  return useQuery({ queryKey: ['club-signups', 'check', token], queryFn: ({ signal }) => checkClubSignup(token, signal), retry: false, staleTime: Infinity });
}

/** POST /api/club-signups/confirm: makes the club; a new account comes back signed in. */
export function confirmClubSignup(token: string): Promise<ClubSignupResult> {
  return apiFetch('/api/club-signups/confirm', { method: 'POST', body: { token }, schema: ClubSignupResultSchema });
}

export function useConfirmClubSignup() {
  return useMutation({ mutationFn: confirmClubSignup });
}
