import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

/** DELETE /api/plantings/:plantingId: the planting and its harvests. */
export function deletePlanting(plantingId: number): Promise<undefined> {
  return apiFetch(`/api/plantings/${plantingId}`, { method: 'DELETE' });
}

/** Removes a planting and refreshes the plot's book. */
export function useDeletePlanting(plotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: (plantingId: number) => deletePlanting(plantingId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plotBookKeys.plot(plotId) }),
  });
}
