import { useMutation, useQueryClient } from '@tanstack/react-query';
import { HarvestSchema, type HarvestBody } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

/** POST /api/plantings/:plantingId/harvests: a weight (any unit, kept as grams) and or a count. */
export function addHarvest(plantingId: number, body: Partial<HarvestBody> & Pick<HarvestBody, 'harvestedOn'>) {
  return apiFetch(`/api/plantings/${plantingId}/harvests`, { method: 'POST', body, schema: HarvestSchema });
}

/** Logs a harvest and refreshes the plot's book and its totals. */
export function useAddHarvest(plotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ plantingId, body }: { plantingId: number; body: Parameters<typeof addHarvest>[1] }) => addHarvest(plantingId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plotBookKeys.plot(plotId) }),
  });
}
