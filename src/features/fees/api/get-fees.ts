import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { FeesListSchema } from '@shared/schemas/fees';
import { apiFetch } from '@/lib/api/client';
import { feesKeys, type FeesListFilters } from './keys';

function feesQueryString({ year, status }: Omit<FeesListFilters, 'clubId'>): string {
  const params = new URLSearchParams({ status });
  if (year) params.set('year', String(year));
  return params.toString();
}

/** GET /api/clubs/:clubId/fees (coordinators): fees with payments, unpaid first, and totals in minor units. */
export function getFees({ clubId, ...filters }: FeesListFilters, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/fees?${feesQueryString(filters)}`, { schema: FeesListSchema, signal });
}

/** Query options for one filtered list of a club's fees. */
export function feesQueryOptions(filters: FeesListFilters) {
  return queryOptions({ queryKey: feesKeys.list(filters), queryFn: ({ signal }) => getFees(filters, signal) });
}

/** A club's fees; while a new filter loads, the last list stays on screen. */
export function useFees(filters: FeesListFilters) {
  return useQuery({ ...feesQueryOptions(filters), placeholderData: keepPreviousData });
}
