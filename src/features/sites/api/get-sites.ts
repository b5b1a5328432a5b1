import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { SiteSchema } from '@shared/schemas/sites';
import { apiFetch } from '@/lib/api/client';
import { sitesKeys } from './keys';

const SitesPageSchema = pageSchema(SiteSchema);

/** GET /api/clubs/:clubId/sites: the club's sites, by name. */
export function getSites(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/sites`, { schema: SitesPageSchema, signal });
}

/** Query options for a club's sites. */
export function sitesQueryOptions(clubId: number) {
  return queryOptions({ queryKey: sitesKeys.list({ clubId }), queryFn: ({ signal }) => getSites(clubId, signal) });
}

/** The club's sites, one page as the server sends it. */
export function useSites(clubId: number) {
  return useQuery(sitesQueryOptions(clubId));
}
