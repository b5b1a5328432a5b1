import { queryOptions, useQuery } from '@tanstack/react-query';
import { FindingListSchema } from '@shared/schemas/findings';
import { apiFetch } from '@/lib/api/client';
import { clubFindingsKeys } from './club-findings-keys';

/** GET /api/sites/:siteId/findings?seasonId= (coordinators): every finding of one site's plantings in a season. */
export function getSiteFindings(siteId: number, seasonId: number, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}/findings?seasonId=${seasonId}`, { schema: FindingListSchema, signal });
}

/** Query options for one site's findings in a season. */
export function siteFindingsQueryOptions(siteId: number, seasonId: number) {
  return queryOptions({ queryKey: clubFindingsKeys.site({ siteId, seasonId }), queryFn: ({ signal }) => getSiteFindings(siteId, seasonId, signal) });
}

/** One site's findings, asked for only once the coordinator turns the neighbour check on and both ids are known. */
export function useSiteFindings(siteId: number, seasonId: number | null, enabled: boolean) {
  return useQuery({ ...siteFindingsQueryOptions(siteId, seasonId ?? 0), enabled: enabled && siteId > 0 && seasonId !== null });
}
