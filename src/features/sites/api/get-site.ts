import { queryOptions, useQuery } from '@tanstack/react-query';
import { SiteSchema } from '@shared/schemas/sites';
import { apiFetch } from '@/lib/api/client';
import { sitesKeys } from './keys';

/** GET /api/sites/:siteId: one site with its plot count and background. */
export function getSite(siteId: number, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}`, { schema: SiteSchema, signal });
}

/** Query options for one site. */
export function siteQueryOptions(siteId: number) {
  return queryOptions({ queryKey: sitesKeys.detail(siteId), queryFn: ({ signal }) => getSite(siteId, signal) });
}

/** One site; pass `enabled: false` while the id is not known to be real. */
export function useSite(siteId: number, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...siteQueryOptions(siteId), enabled });
}
