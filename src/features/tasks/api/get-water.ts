import { queryOptions, useQuery } from '@tanstack/react-query';
import { WaterSummarySchema } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';
import { tasksKeys } from './keys';

/** Weeks of history the water page shows. */
export const WATER_WEEKS = 8;

/** GET /api/sites/:siteId/water?weeks=8 (every member): this week's need, rain and deficit per plot, and the past weeks. */
export function getWater(siteId: number, weeks = WATER_WEEKS, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}/water?weeks=${weeks}`, { schema: WaterSummarySchema, signal });
}

/** Query options for a site's water summary. */
export function waterQueryOptions(siteId: number, weeks = WATER_WEEKS) {
  return queryOptions({ queryKey: tasksKeys.water(siteId, weeks), queryFn: ({ signal }) => getWater(siteId, weeks, signal) });
}

/** A site's water need, rain and deficit. */
export function useWater(siteId: number, weeks = WATER_WEEKS) {
  return useQuery(waterQueryOptions(siteId, weeks));
}
