import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { NeighbourPairSchema } from '@shared/schemas/plots';
import { apiFetch } from '@/lib/api/client';
import { plotsKeys } from './keys';

const NeighboursSchema = z.object({ items: z.array(NeighbourPairSchema), pathWidth: z.number() });

/** GET /api/sites/:siteId/neighbours: neighbouring plot pairs as the server computes them. */
export function getSiteNeighbours(siteId: number, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}/neighbours`, { schema: NeighboursSchema, signal });
}

/** Query options for a site's neighbour pairs. */
export function siteNeighboursQueryOptions(siteId: number) {
  return queryOptions({ queryKey: plotsKeys.neighbours({ siteId }), queryFn: ({ signal }) => getSiteNeighbours(siteId, signal) });
}

/** The neighbour pairs on one site. */
export function useSiteNeighbours(siteId: number) {
  return useQuery(siteNeighboursQueryOptions(siteId));
}
