import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { invalidateSitePlots } from './invalidate';

/** DELETE /api/plots/:plotId?version=N: takes a plot off the map. */
export function deletePlot(plotId: number, version: number) {
  return apiFetch<void>(`/api/plots/${plotId}?version=${version}`, { method: 'DELETE' });
}

/** Removes a plot and refreshes the site's map. */
export function useDeletePlot(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ plotId, version }: { plotId: number; version: number }) => deletePlot(plotId, version),
    onSettled: () => invalidateSitePlots(queryClient, siteId),
  });
}
