import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CropRelationCreateBody } from '@shared/schemas/crops';
import { apiFetch } from '@/lib/api/client';
import { invalidateCropsAndPlotBooks } from './invalidate';

/** POST /api/clubs/:clubId/crops/relations: a relation of the club's own between two crops it can see. */
export function createCropRelation(clubId: number, body: CropRelationCreateBody): Promise<unknown> {
  return apiFetch(`/api/clubs/${clubId}/crops/relations`, { method: 'POST', body });
}

/** DELETE /api/clubs/:clubId/crops/relations/:relationId: only the club's own (reference ones answer 409). */
export function deleteCropRelation(clubId: number, relationId: number): Promise<undefined> {
  return apiFetch(`/api/clubs/${clubId}/crops/relations/${relationId}`, { method: 'DELETE' });
}

/** Adds a club relation and refreshes the crop notes. */
export function useCreateCropRelation(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CropRelationCreateBody) => createCropRelation(clubId, body),
    onSuccess: () => invalidateCropsAndPlotBooks(queryClient),
  });
}

/** Removes a club relation and refreshes the crop notes. */
export function useDeleteCropRelation(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (relationId: number) => deleteCropRelation(clubId, relationId),
    onSuccess: () => invalidateCropsAndPlotBooks(queryClient),
  });
}
