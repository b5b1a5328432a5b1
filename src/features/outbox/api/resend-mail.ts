import { useMutation, useQueryClient } from '@tanstack/react-query';
import { OutboxMessageSchema } from '@shared/schemas/outbox';
import { apiFetch } from '@/lib/api/client';
import { outboxKeys } from './keys';

/** POST /api/clubs/:clubId/outbox/:messageId/resend: puts a failed message back in the queue and sends it. */
export function resendMail(clubId: number, messageId: number) {
  return apiFetch(`/api/clubs/${clubId}/outbox/${messageId}/resend`, { method: 'POST', schema: OutboxMessageSchema });
}

/** Resends one failed message and refreshes the club's lists. */
export function useResendMail(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (messageId: number) => resendMail(clubId, messageId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: outboxKeys.clubLists(clubId) }),
  });
}
