import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionInfo } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { authKeys } from './keys';

/** PUT /api/session/club: the club the person is working in, so the next sign-in opens it. */
export function rememberClub(clubId: number): Promise<undefined> {
  return apiFetch('/api/session/club', { method: 'PUT', body: { clubId } });
}

/** Tells the server which club is open and keeps the cached session's start club in step. */
export function useRememberClub() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rememberClub,
    onSuccess: (_none, clubId) =>
      queryClient.setQueryData<SessionInfo>(authKeys.session(), (old) =>
        old?.user ? { ...old, user: { ...old.user, startClubId: clubId } } : old,
      ),
  });
}
