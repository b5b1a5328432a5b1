import { useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { LeftOutHolderSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

const LeftOutPageSchema = pageSchema(LeftOutHolderSchema);

/** GET /api/seasons/:seasonId/left-out: last season's holders with no renewal this season, and why. */
export function getLeftOut(seasonId: number, signal?: AbortSignal) {
  return apiFetch(`/api/seasons/${seasonId}/left-out`, { schema: LeftOutPageSchema, signal });
}

export function useLeftOut(seasonId: number) {
  return useQuery({ queryKey: springRoundKeys.leftOut(seasonId), queryFn: ({ signal }) => getLeftOut(seasonId, signal) });
}
