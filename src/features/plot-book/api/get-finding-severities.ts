import { useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { PlotBookSeveritiesShape } from '@/lib/api/response-shapes.gen';
import { plotBookKeys } from './keys';

/**
 * GET /api/plots/:plotId/book, read for its findings' severities only: the holder's home shows the
 * neighbour check's counts, and checks the answer by a generated shape so zod stays off that page.
 */
export function getFindingSeverities(plotId: number, signal?: AbortSignal) {
  return apiFetch(`/api/plots/${plotId}/book`, { schema: PlotBookSeveritiesShape, signal });
}

/** This season's findings on a plot, by severity only. */
export function useFindingSeverities(plotId: number) {
  return useQuery({ queryKey: plotBookKeys.severities(plotId), queryFn: ({ signal }) => getFindingSeverities(plotId, signal) });
}
