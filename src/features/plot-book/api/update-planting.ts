import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlantingSchema, type PlantingUpdateBody } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

/** PATCH /api/plantings/:plantingId with the version last read (409 when someone changed it meanwhile). */
export function updatePlanting(plantingId: number, body: PlantingUpdateBody) {
  return apiFetch(`/api/plantings/${plantingId}`, { method: 'PATCH', body, schema: PlantingSchema });
}

/** Changes a planting (its status, say) and refreshes the plot's book. */
export function useUpdatePlanting(plotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: ({ plantingId, body }: { plantingId: number; body: PlantingUpdateBody }) => updatePlanting(plantingId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plotBookKeys.plot(plotId) }),
  });
}
