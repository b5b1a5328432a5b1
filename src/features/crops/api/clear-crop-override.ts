import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OverridableCropField } from '@shared/schemas/crops';
import { apiFetch } from '@/lib/api/client';
import { invalidateCropsAndPlotBooks } from './invalidate';

/** DELETE /api/clubs/:clubId/crops/:cropId/overrides/:field: the reference value shows again. */
export function clearCropOverride(clubId: number, cropId: number, field: OverridableCropField) {
  return apiFetch<void>(`/api/clubs/${clubId}/crops/${cropId}/overrides/${field}`, { method: 'DELETE' });
}

/** Removes a club value and refreshes the crop notes and the plot books that use it. */
export function useClearCropOverride(clubId: number, cropId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (field: OverridableCropField) => clearCropOverride(clubId, cropId, field),
    onSuccess: () => invalidateCropsAndPlotBooks(queryClient),
  });
}
