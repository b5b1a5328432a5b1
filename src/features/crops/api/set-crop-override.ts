import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CropDetailSchema, type CropOverrideBody, type OverridableCropField } from '@shared/schemas/crops';
import { apiFetch } from '@/lib/api/client';
import { invalidateCropsAndPlotBooks } from './invalidate';

/** PUT /api/clubs/:clubId/crops/:cropId/overrides/:field: the club's own value, with its source, for one field of a reference crop. */
export function setCropOverride(clubId: number, cropId: number, field: OverridableCropField, body: CropOverrideBody) {
  return apiFetch(`/api/clubs/${clubId}/crops/${cropId}/overrides/${field}`, { method: 'PUT', body, schema: CropDetailSchema });
}

/** Sets a club value and refreshes the crop notes and the plot books that use it. */
export function useSetCropOverride(clubId: number, cropId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ field, body }: { field: OverridableCropField; body: CropOverrideBody }) => setCropOverride(clubId, cropId, field, body),
    onSuccess: () => invalidateCropsAndPlotBooks(queryClient),
  });
}
