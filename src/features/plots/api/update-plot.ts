import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlotSchema, type Plot, type PlotUpdateBody } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
import { plotsKeys } from './keys';
import { invalidateSitePlots } from './invalidate';

type PlotsPage = { items: Plot[]; page: number; total: number };

/** PATCH /api/plots/:plotId with the version the editor last saw. */
export function updatePlot(plotId: number, body: PlotUpdateBody) {
  return apiFetch(`/api/plots/${plotId}`, { method: 'PATCH', body, schema: PlotSchema });
}

/**
 * Saves a change to a plot, showing it on the map at once (optimistic) and putting the
 * server's answer, or the server's current map after a refusal, in its place. Changes on one
 * site run one after another, each sent with the newest version this browser has seen, so a
 * quick second edit of the same plot is not mistaken for someone else's.
 */
export function useUpdatePlot(siteId: number) {
  const queryClient = useQueryClient();
  const key = plotsKeys.list({ siteId });
  return useMutation({
    scope: { id: `plots-of-site-${siteId}` },
    mutationFn: ({ plotId, body }: { plotId: number; body: PlotUpdateBody }) => {
      const known = queryClient.getQueryData<PlotsPage>(key)?.items.find((p) => p.id === plotId);
      return updatePlot(plotId, { ...body, version: Math.max(body.version, known?.version ?? 0) });
    },
    onMutate: async ({ plotId, body }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<PlotsPage>(key);
      if (previous) {
        const { version: _version, ...changes } = body;
        queryClient.setQueryData(key, {
          ...previous,
          items: previous.items.map((p) => (p.id === plotId ? { ...p, ...changes } : p)),
        });
      }
      return { previous };
    },
    onSuccess: (saved) => {
      queryClient.setQueryData<PlotsPage>(key, (page) =>
        page ? { ...page, items: page.items.map((p) => (p.id === saved.id ? saved : p)) } : page,
      );
    },
    onError: (_err, _vars, context) => {
      if (context?.previous) queryClient.setQueryData(key, context.previous);
    },
    onSettled: () => invalidateSitePlots(queryClient, siteId),
  });
}
