import { queryOptions, useQuery } from '@tanstack/react-query';
import { CropDetailSchema } from '@shared/schemas/crops';
import { apiFetch } from '@/lib/api/client';
import { cropsKeys } from './keys';

/** GET /api/clubs/:clubId/crops/:cropId: one crop with the club's own values applied, its relations and sources. */
export function getCrop(clubId: number, cropId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/crops/${cropId}`, { schema: CropDetailSchema, signal });
}

/** Query options for one crop's page. */
export function cropQueryOptions(clubId: number, cropId: number) {
  return queryOptions({
    queryKey: cropsKeys.detail({ clubId, cropId }),
    queryFn: ({ signal }) => getCrop(clubId, cropId, signal),
  });
}

/** One crop as the club sees it. */
export function useCrop(clubId: number, cropId: number) {
  return useQuery(cropQueryOptions(clubId, cropId));
}
