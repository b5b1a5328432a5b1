import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { PlotSeasonStateSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

const StatesPageSchema = pageSchema(PlotSeasonStateSchema);

/** GET /api/seasons/:seasonId/plot-states?siteId=: where each plot of a site stands this season. */
export function getPlotStates(seasonId: number, siteId: number, signal?: AbortSignal) {
  return apiFetch(`/api/seasons/${seasonId}/plot-states?siteId=${siteId}`, { schema: StatesPageSchema, signal });
}

/** Query options for a site's plot states in a season. */
export function plotStatesQueryOptions(seasonId: number, siteId: number) {
  return queryOptions({
    queryKey: springRoundKeys.plotStates({ seasonId, siteId }),
    queryFn: ({ signal }) => getPlotStates(seasonId, siteId, signal),
  });
}

/** Free, offered, renewing and taken plots of one site in one season (waits while there is no season). */
export function usePlotStates(seasonId: number | null, siteId: number) {
  // Both ids must be known: the seasons can load before the sites, and siteId 0 is no site (the server answers 400).
  return useQuery({ ...plotStatesQueryOptions(seasonId ?? 0, siteId), enabled: seasonId !== null && siteId > 0 });
}
