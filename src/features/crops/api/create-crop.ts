import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CropDetailSchema, type CropCreateBody } from '@shared/schemas/crops';
import { apiFetch } from '@/lib/api/client';
import { invalidateCropsAndPlotBooks } from './invalidate';

/** POST /api/clubs/:clubId/crops: a crop of the club's own. */
export function createCrop(clubId: number, body: CropCreateBody) {
  return apiFetch(`/api/clubs/${clubId}/crops`, { method: 'POST', body, schema: CropDetailSchema });
}

/** Adds a club crop and refreshes the crop notes (and the plot books, whose crop choices list it). */
export function useCreateCrop(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CropCreateBody) => createCrop(clubId, body),
    onSuccess: () => invalidateCropsAndPlotBooks(queryClient),
  });
}
