import { useMutation, useQueryClient } from '@tanstack/react-query';
import { InviteSchema } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

/** POST /api/clubs/:clubId/invites/:inviteId/resend: a new link with 14 more days; the old link stops working. */
export function resendInvite(clubId: number, inviteId: number) {
  return apiFetch(`/api/clubs/${clubId}/invites/${inviteId}/resend`, { method: 'POST', schema: InviteSchema });
}

/** Sends an invite again and refreshes the club's invites list (its expiry moves on). */
export function useResendInvite(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (inviteId: number) => resendInvite(clubId, inviteId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersKeys.list({ clubId, kind: 'invites' }) }),
  });
}
