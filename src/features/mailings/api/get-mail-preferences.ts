import { queryOptions, useQuery } from '@tanstack/react-query';
import { MailPreferencesSchema } from '@shared/schemas/mailings';
import { apiFetch } from '@/lib/api/client';
import { mailingsKeys } from './keys';

/** GET /api/clubs/:clubId/mail-preferences: the signed-in person's optional e-mail choices in the club. */
export function getMailPreferences(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/mail-preferences`, { schema: MailPreferencesSchema, signal });
}

/** Query options for the person's e-mail choices. */
export function mailPreferencesQueryOptions(clubId: number) {
  return queryOptions({
    queryKey: mailingsKeys.preferences({ clubId }),
    queryFn: ({ signal }) => getMailPreferences(clubId, signal),
  });
}

/** The person's e-mail choices in one club. */
export function useMailPreferences(clubId: number) {
  return useQuery(mailPreferencesQueryOptions(clubId));
}
