import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { SeasonSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

const SeasonsPageSchema = pageSchema(SeasonSchema);

/** GET /api/clubs/:clubId/seasons: the club's seasons, newest first. */
export function getSeasons(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/seasons`, { schema: SeasonsPageSchema, signal });
}

/** Query options for a club's seasons. */
export function seasonsQueryOptions(clubId: number) {
  return queryOptions({ queryKey: springRoundKeys.list({ clubId }), queryFn: ({ signal }) => getSeasons(clubId, signal) });
}

/** The club's seasons, newest first. */
export function useSeasons(clubId: number) {
  return useQuery(seasonsQueryOptions(clubId));
}
