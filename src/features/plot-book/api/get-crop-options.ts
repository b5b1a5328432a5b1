import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { CropSummarySchema } from '@shared/schemas/crops';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

const CropPageSchema = pageSchema(CropSummarySchema);

/** GET /api/clubs/:clubId/crops?pageSize=100: every crop the club can plant, by name, for the planting form. */
export function getCropOptions(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/crops?pageSize=100&sort=name`, { schema: CropPageSchema, signal });
}

/** Query options for the crops a planting can name; the catalogue changes rarely, so it is kept a while. */
export function cropOptionsQueryOptions(clubId: number) {
  return queryOptions({
    queryKey: plotBookKeys.cropOptions(clubId),
    queryFn: ({ signal }) => getCropOptions(clubId, signal),
    staleTime: 10 * 60_000,
  });
}

/** The club's crops, by name. */
export function useCropOptions(clubId: number) {
  return useQuery(cropOptionsQueryOptions(clubId));
}
