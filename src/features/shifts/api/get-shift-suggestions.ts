import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { ShiftSuggestionListSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

export interface SuggestionFilters {
  clubId: number;
  from: string;
  to: string;
  siteId?: number;
}

/** GET /api/clubs/:clubId/shift-suggestions?from&to&siteId (coordinators): open tasks not yet in a shift, grouped by site, date and kind. */
export function getShiftSuggestions({ clubId, from, to, siteId }: SuggestionFilters, signal?: AbortSignal) {
  const q = new URLSearchParams({ from, to });
  if (siteId !== undefined) q.set('siteId', String(siteId));
  return apiFetch(`/api/clubs/${clubId}/shift-suggestions?${q.toString()}`, { schema: ShiftSuggestionListSchema, signal });
}

/** Query options for the suggestions of a range. */
export function shiftSuggestionsQueryOptions(filters: SuggestionFilters) {
  return queryOptions({ queryKey: shiftsKeys.suggestionList(filters), queryFn: ({ signal }) => getShiftSuggestions(filters, signal) });
}

/** The suggested shifts of a range; the last answer stays while another range loads. */
export function useShiftSuggestions(filters: SuggestionFilters) {
  return useQuery({ ...shiftSuggestionsQueryOptions(filters), placeholderData: keepPreviousData });
}
