import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PlantingSchema, type PlantingBody } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

/** The body as the form sends it: the server fills the defaults. */
export type PlantingInput = Partial<PlantingBody> & Pick<PlantingBody, 'cropId' | 'method' | 'plantedOn'>;

/** POST /api/plots/:plotId/plantings: adds a planting to this season. */
export function createPlanting(plotId: number, body: PlantingInput) {
  return apiFetch(`/api/plots/${plotId}/plantings`, { method: 'POST', body, schema: PlantingSchema });
}

/** Adds a planting and refreshes the plot's book. */
export function useCreatePlanting(plotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: (body: PlantingInput) => createPlanting(plotId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plotBookKeys.plot(plotId) }),
  });
}
