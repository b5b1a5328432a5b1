import { queryOptions, useQuery } from '@tanstack/react-query';
import { MailingAudienceCountSchema, type MailingAudience } from '@shared/schemas/mailings';
import { apiFetch } from '@/lib/api/client';
import { mailingsKeys } from './keys';

/** GET /api/clubs/:clubId/mailings/audience: how many people a message would reach now, and how many opted out. */
export function getMailingAudience(clubId: number, audience: MailingAudience, signal?: AbortSignal) {
  const query = new URLSearchParams(Object.entries(audience).map(([k, v]) => [k, String(v)]));
  return apiFetch(`/api/clubs/${clubId}/mailings/audience?${query}`, { schema: MailingAudienceCountSchema, signal });
}

/** Query options for an audience's count; always asked afresh, since members come and go. */
export function mailingAudienceQueryOptions(clubId: number, audience: MailingAudience) {
  return queryOptions({
    queryKey: mailingsKeys.audience({ clubId, ...audience }),
    queryFn: ({ signal }) => getMailingAudience(clubId, audience, signal),
    staleTime: 0,
  });
}

/** The recipient count for the message about to be sent (nothing is asked while there is no audience). */
export function useMailingAudience(clubId: number, audience: MailingAudience | null) {
  return useQuery({ ...mailingAudienceQueryOptions(clubId, audience ?? { kind: 'all_members' }), enabled: audience !== null });
}
