import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { PlotSchema } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
import { plotsKeys } from './keys';

const PlotsPageSchema = pageSchema(PlotSchema);

/** GET /api/sites/:siteId/plots: every live plot on a site. */
export function getSitePlots(siteId: number, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}/plots`, { schema: PlotsPageSchema, signal });
}

/** Query options for a site's plots. */
export function sitePlotsQueryOptions(siteId: number) {
  return queryOptions({ queryKey: plotsKeys.list({ siteId }), queryFn: ({ signal }) => getSitePlots(siteId, signal) });
}

/** The plots on one site. */
export function useSitePlots(siteId: number) {
  return useQuery(sitePlotsQueryOptions(siteId));
}
