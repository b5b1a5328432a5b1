import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { MyPlotShape } from '@/lib/api/response-shapes.gen';
import { plotsKeys } from './keys';

/** GET /api/clubs/:clubId/my-plot: the signed-in person's own plot and renewal waiting for an answer. */
export function getMyPlot(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/my-plot`, { schema: MyPlotShape, signal });
}

/** Query options for the signed-in person's plot in one club. */
export function myPlotQueryOptions(clubId: number) {
  return queryOptions({ queryKey: plotsKeys.mine(clubId), queryFn: ({ signal }) => getMyPlot(clubId, signal) });
}

/** The signed-in person's plot and pending renewal in one club. */
export function useMyPlot(clubId: number) {
  return useQuery(myPlotQueryOptions(clubId));
}
