import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlotSchema, type Plot, type PlotUpdateBody } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
import { plotsKeys } from './keys';
import { invalidateSitePlots } from './invalidate';

/** PATCH /api/plots/:plotId with the version the editor last saw. */
export function updatePlot(plotId: number, body: PlotUpdateBody) {
  return apiFetch(`/api/plots/${plotId}`, { method: 'PATCH', body, schema: PlotSchema });
}

/**
 * Saves a change to a plot, showing it on the map at once (optimistic) and putting the
 * server's answer, or the server's current map after a refusal, in its place.
 */
export function useUpdatePlot(siteId: number) {
  const queryClient = useQueryClient();
  const key = plotsKeys.list({ siteId });
  return useMutation({
    mutationFn: ({ plotId, body }: { plotId: number; body: PlotUpdateBody }) => updatePlot(plotId, body),
    onMutate: async ({ plotId, body }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<{ items: Plot[]; page: number; total: number }>(key);
      if (previous) {
        const { version: _version, ...changes } = body;
        queryClient.setQueryData(key, {
          ...previous,
          items: previous.items.map((p) => (p.id === plotId ? { ...p, ...changes } : p)),
        });
      }
      return { previous };
    },
    onError: (_err, _vars, context) => {
      if (context?.previous) queryClient.setQueryData(key, context.previous);
    },
    onSettled: () => invalidateSitePlots(queryClient, siteId),
  });
}
