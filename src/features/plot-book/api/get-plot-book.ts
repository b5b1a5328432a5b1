import { queryOptions, useQuery } from '@tanstack/react-query';
import { PlotBookSchema } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

/** GET /api/plots/:plotId/book?year=: one season's plantings, harvests and the plot's observations. */
export function getPlotBook(plotId: number, year?: number, signal?: AbortSignal) {
  return apiFetch(`/api/plots/${plotId}/book${year ? `?year=${year}` : ''}`, { schema: PlotBookSchema, signal });
}

/** Query options for a plot book, this season unless a year is given. */
export function plotBookQueryOptions(plotId: number, year?: number) {
  return queryOptions({ queryKey: plotBookKeys.detail({ plotId, year }), queryFn: ({ signal }) => getPlotBook(plotId, year, signal) });
}

/** A plot's book for one season. */
export function usePlotBook(plotId: number, year?: number) {
  return useQuery(plotBookQueryOptions(plotId, year));
}
