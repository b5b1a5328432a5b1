import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

/** DELETE /api/clubs/:clubId/invites/:inviteId: the link stops working. */
export function cancelInvite(clubId: number, inviteId: number): Promise<undefined> {
  return apiFetch(`/api/clubs/${clubId}/invites/${inviteId}`, { method: 'DELETE' });
}

/** Cancels an invite and refreshes the club's pending-invites list. */
export function useCancelInvite(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (inviteId: number) => cancelInvite(clubId, inviteId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersKeys.list({ clubId, kind: 'invites' }) }),
  });
}
