import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlotImportResultSchema, type PlotImportBody } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
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
