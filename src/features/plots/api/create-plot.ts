import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlotSchema, type PlotCreateBody } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
import { invalidateSitePlots } from './invalidate';

/** POST /api/sites/:siteId/plots: draws a new plot. */
export function createPlot(siteId: number, body: Partial<PlotCreateBody> & Pick<PlotCreateBody, 'label' | 'x' | 'y' | 'width' | 'length'>) {
  return apiFetch(`/api/sites/${siteId}/plots`, { method: 'POST', body, schema: PlotSchema });
}

/** Creates a plot and refreshes the site's map. */
export function useCreatePlot(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Parameters<typeof createPlot>[1]) => createPlot(siteId, body),
    onSettled: () => invalidateSitePlots(queryClient, siteId),
  });
}
