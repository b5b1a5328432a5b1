import { queryOptions, useQuery } from '@tanstack/react-query';
import { SeasonSummarySchema } from '@shared/schemas/season-summary';
import { apiFetch } from '@/lib/api/client';
import { seasonSummaryKeys } from './keys';

/** GET /api/clubs/:clubId/season-summary (coordinators): plots by state per site, fees, shift places, findings and harvest. */
export function getSeasonSummary(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/season-summary`, { schema: SeasonSummarySchema, signal });
}

/** Query options for the season at a glance. */
export function seasonSummaryQueryOptions(clubId: number) {
  return queryOptions({ queryKey: seasonSummaryKeys.detail(clubId), queryFn: ({ signal }) => getSeasonSummary(clubId, signal) });
}

/** The coordinator's season at a glance. */
export function useSeasonSummary(clubId: number) {
  return useQuery(seasonSummaryQueryOptions(clubId));
}
