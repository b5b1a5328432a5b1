import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { WaitlistEntrySchema } from '@shared/schemas/applications';
import { pageSchema } from '@shared/schemas/common';
import { apiFetch } from '@/lib/api/client';
import { waitlistKeys, type WaitlistFilters } from './keys';

const WaitlistPageSchema = pageSchema(WaitlistEntrySchema);

/** GET /api/clubs/:clubId/waitlist: the queue in order, filtered (coordinators only). */
export function getWaitlist(clubId: number, filters: WaitlistFilters, signal?: AbortSignal) {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) if (value !== undefined && value !== '') params.set(key, String(value));
  const query = params.toString();
  return apiFetch(`/api/clubs/${clubId}/waitlist${query ? `?${query}` : ''}`, { schema: WaitlistPageSchema, signal });
}

/** Query options for one filtered view of the waiting list. */
export function waitlistQueryOptions(clubId: number, filters: WaitlistFilters) {
  return queryOptions({
    queryKey: waitlistKeys.list(clubId, filters),
    queryFn: ({ signal }) => getWaitlist(clubId, filters, signal),
    // Changing a filter keeps the last rows on screen until the new ones arrive.
    placeholderData: keepPreviousData,
  });
}

/** The club's waiting list with the given filters. */
export function useWaitlist(clubId: number, filters: WaitlistFilters) {
  return useQuery(waitlistQueryOptions(clubId, filters));
}
