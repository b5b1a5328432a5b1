import { queryOptions, useQuery } from '@tanstack/react-query';
import { WaitlistEntrySchema } from '@shared/schemas/applications';
import { pageSchema } from '@shared/schemas/common';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

const WaitingSchema = pageSchema(WaitlistEntrySchema);

/** GET /api/clubs/:clubId/waitlist?status=waiting: the people an offer can go to, in queue order. */
export function getWaitingPeople(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/waitlist?status=waiting`, { schema: WaitingSchema, signal });
}

/** Query options for the people waiting in a club. */
export function waitingPeopleQueryOptions(clubId: number) {
  return queryOptions({ queryKey: [...springRoundKeys.all, 'waiting', { clubId }], queryFn: ({ signal }) => getWaitingPeople(clubId, signal) });
}

/** The people waiting for a plot, as the spring round offers to them. */
export function useWaitingPeople(clubId: number) {
  return useQuery(waitingPeopleQueryOptions(clubId));
}
