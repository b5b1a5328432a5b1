import { queryOptions, useQuery } from '@tanstack/react-query';
import { CropSummarySchema, type CropSummary } from '@shared/schemas/crops';
import { pageSchema } from '@shared/schemas/common';
import { apiFetch } from '@/lib/api/client';
import { cropsKeys } from './keys';

const CropsPageSchema = pageSchema(CropSummarySchema);
// The server's largest page; a club sees about 32 reference crops plus its own, so one page is the usual case.
const PAGE_SIZE = 100;

/**
 * GET /api/clubs/:clubId/crops, every page: the list is small, so the table sorts and filters it
 * in the browser instead of asking the server on each keystroke.
 */
export async function getCrops(clubId: number, signal?: AbortSignal): Promise<{ items: CropSummary[]; total: number }> {
  const items: CropSummary[] = [];
  for (let page = 1; ; page += 1) {
    const answer = await apiFetch(`/api/clubs/${clubId}/crops?page=${page}&pageSize=${PAGE_SIZE}`, { schema: CropsPageSchema, signal });
    items.push(...answer.items);
    if (answer.items.length < PAGE_SIZE || items.length >= answer.total) return { items, total: answer.total };
  }
}

/** Query options for the crops a club sees (reference crops and its own). */
export function cropsQueryOptions(clubId: number) {
  return queryOptions({ queryKey: cropsKeys.list({ clubId }), queryFn: ({ signal }) => getCrops(clubId, signal) });
}

/** The crops a club sees, all of them. */
export function useCrops(clubId: number) {
  return useQuery(cropsQueryOptions(clubId));
}
