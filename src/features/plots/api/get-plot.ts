import { queryOptions, useQuery } from '@tanstack/react-query';
import { PlotDetailSchema } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
import { plotsKeys } from './keys';

/** GET /api/plots/:plotId: one plot with its neighbours and history. */
export function getPlot(plotId: number, signal?: AbortSignal) {
  return apiFetch(`/api/plots/${plotId}`, { schema: PlotDetailSchema, signal });
}

/** Query options for one plot's page. */
export function plotQueryOptions(plotId: number) {
  return queryOptions({ queryKey: plotsKeys.detail(plotId), queryFn: ({ signal }) => getPlot(plotId, signal) });
}

/** One plot with its neighbours and history. */
export function usePlot(plotId: number) {
  return useQuery(plotQueryOptions(plotId));
}
