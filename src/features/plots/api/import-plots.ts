import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlotImportResultSchema, type PlotImportBody, type PlotImportResult } from '@shared/schemas/plots';
import { apiFetch, isApiError } from '@/lib/api/client';
import { invalidateSitePlots } from './invalidate';

/** POST /api/sites/:siteId/plot-imports: checks a CSV (commit false) or saves every row of it or none (commit true). */
export function importPlots(siteId: number, body: PlotImportBody) {
  return apiFetch(`/api/sites/${siteId}/plot-imports`, { method: 'POST', body, schema: PlotImportResultSchema });
}

/** Checks or imports a plot CSV; a committed import refreshes the site's plots. */
export function useImportPlots(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PlotImportBody) => importPlots(siteId, body),
    onSuccess: async (result) => {
      if (result.committed) await invalidateSitePlots(queryClient, siteId);
    },
  });
}

const FIELD_KEY = /^row (\d+)(?:\.(.+))?$/;

/**
 * The row problems of a refused commit (400 with fields keyed "row 4.width" or "row 1"), for when
 * the site changed between the check and the import; null when the error is of another kind.
 */
export function importErrorsOf(error: unknown): PlotImportResult['errors'] | null {
  if (!isApiError(error, 400) || !error.fields) return null;
  const errors: PlotImportResult['errors'] = [];
  for (const [key, message] of Object.entries(error.fields)) {
    const match = FIELD_KEY.exec(key);
    if (!match) return null;
    errors.push({ row: Number(match[1]), field: match[2] ?? '', message });
  }
  return errors.sort((a, b) => a.row - b.row);
}
