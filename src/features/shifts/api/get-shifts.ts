import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { ShiftListSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsApiQuery } from '../lib/board-params';
import { shiftsKeys, type ShiftListFilters } from './keys';

/** GET /api/clubs/:clubId/shifts?from&to&siteId&kind&open=true (any member): the board for a range of the sites' dates. */
export function getShifts({ clubId, ...filters }: ShiftListFilters, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/shifts${shiftsApiQuery(filters)}`, { schema: ShiftListSchema, signal });
}

/** Query options for the board with its filters. */
export function shiftsQueryOptions(filters: ShiftListFilters) {
  return queryOptions({ queryKey: shiftsKeys.list(filters), queryFn: ({ signal }) => getShifts(filters, signal) });
}

/** The shifts of a range; while the next week loads, the last one stays on screen. */
export function useShifts(filters: ShiftListFilters) {
  return useQuery({ ...shiftsQueryOptions(filters), placeholderData: keepPreviousData });
}
