import { useMutation, useQueryClient } from '@tanstack/react-query';
import { MailingSentSchema, type MailingCreateBody } from '@shared/schemas/mailings';
import { apiFetch } from '@/lib/api/client';
import { mailingsKeys } from './keys';

/** POST /api/clubs/:clubId/mailings: e-mails each person in the audience their own copy. */
export function sendMailing(clubId: number, body: MailingCreateBody) {
  return apiFetch(`/api/clubs/${clubId}/mailings`, { method: 'POST', body, schema: MailingSentSchema });
}

/** Sends a club message and refreshes the sent list. */
export function useSendMailing(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MailingCreateBody) => sendMailing(clubId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mailingsKeys.list({ clubId }) }),
  });
}
