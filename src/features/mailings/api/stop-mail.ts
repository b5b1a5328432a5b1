import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { MailStopPreviewSchema } from '@shared/schemas/mail-templates';
import { apiFetch } from '@/lib/api/client';
import { mailingsKeys } from './keys';

/** GET /api/mail-stops/:token (no sign-in): what an e-mail's stop link turns off; opening it changes nothing. */
export function getMailStop(token: string, signal?: AbortSignal) {
  return apiFetch(`/api/mail-stops/${encodeURIComponent(token)}`, { schema: MailStopPreviewSchema, signal });
}

export function mailStopQueryOptions(token: string) {
  return queryOptions({ queryKey: mailingsKeys.stop(token), queryFn: ({ signal }) => getMailStop(token, signal), retry: false });
}

/** The stop link's preview; `enabled: false` when the page has no token. */
export function useMailStop(token: string) {
  return useQuery({ ...mailStopQueryOptions(token), enabled: token.length > 0 });
}

/** POST /api/mail-stops/:token: turns that kind of mail off (the same address as the one-click of RFC 8058). */
export function stopMail(token: string) {
  return apiFetch(`/api/mail-stops/${encodeURIComponent(token)}`, { method: 'POST', schema: MailStopPreviewSchema });
}

export function useStopMail(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => stopMail(token),
    onSuccess: (preview) => queryClient.setQueryData(mailingsKeys.stop(token), preview),
  });
}
