import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { MailingSchema } from '@shared/schemas/mailings';
import { apiFetch } from '@/lib/api/client';
import { mailingsKeys } from './keys';

const MailingsPageSchema = pageSchema(MailingSchema);

/** GET /api/clubs/:clubId/mailings: messages the club sent, newest first (coordinators only). */
export function getMailings(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/mailings`, { schema: MailingsPageSchema, signal });
}

/** Query options for a club's sent messages. */
export function mailingsQueryOptions(clubId: number) {
  return queryOptions({ queryKey: mailingsKeys.list({ clubId }), queryFn: ({ signal }) => getMailings(clubId, signal) });
}

/** The club's sent messages. */
export function useMailings(clubId: number) {
  return useQuery(mailingsQueryOptions(clubId));
}
