import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { PlotsPageShape } from '@/lib/api/response-shapes.gen';
import { plotsKeys } from './keys';

/** GET /api/sites/:siteId/plots: every live plot on a site. */
export function getSitePlots(siteId: number, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}/plots`, { schema: PlotsPageShape, signal });
}

/** Query options for a site's plots. */
export function sitePlotsQueryOptions(siteId: number) {
  return queryOptions({ queryKey: plotsKeys.list({ siteId }), queryFn: ({ signal }) => getSitePlots(siteId, signal) });
}

/** The plots on one site. */
export function useSitePlots(siteId: number) {
  return useQuery(sitePlotsQueryOptions(siteId));
}
