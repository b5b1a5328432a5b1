import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SessionInfoSchema, type SessionInfo, type SignInBody } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { storeSession } from './get-session';

/** POST /api/session: signs in with e-mail and password. */
export function signIn(body: SignInBody): Promise<SessionInfo> {
  return apiFetch('/api/session', { method: 'POST', body, schema: SessionInfoSchema });
}

/** Signs in and stores the new session; the signed-out guard then sends the person home. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => storeSession(queryClient, session),
  });
}
