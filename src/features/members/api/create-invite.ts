import { useMutation, useQueryClient } from '@tanstack/react-query';
import { InviteSchema, type Invite, type InviteCreateBody } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

/** POST /api/clubs/:clubId/invites: sends an invite e-mail. */
export function createInvite(clubId: number, body: InviteCreateBody): Promise<Invite> {
  return apiFetch(`/api/clubs/${clubId}/invites`, { method: 'POST', body, schema: InviteSchema });
}

/** Creates an invite and refreshes the club's pending-invites list. */
export function useCreateInvite(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteCreateBody) => createInvite(clubId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersKeys.list({ clubId, kind: 'invites' }) }),
  });
}
