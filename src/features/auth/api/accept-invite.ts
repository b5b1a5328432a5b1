import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SessionInfoSchema, type InviteAcceptBody, type SessionInfo } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { storeSession } from './get-session';

/** POST /api/invites/accept: joins the club; the server signs the person in and answers with the session. */
export function acceptInvite(body: InviteAcceptBody): Promise<SessionInfo> {
  return apiFetch('/api/invites/accept', { method: 'POST', body, schema: SessionInfoSchema });
}

/** Accepts an invite and stores the resulting session. */
export function useAcceptInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvite,
    onSuccess: (session) => storeSession(queryClient, session),
  });
}
