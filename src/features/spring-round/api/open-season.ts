import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { SeasonSchema, type SeasonCreateBody } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

export const OpenSeasonResultSchema = z.object({
  season: SeasonSchema,
  renewalsSent: z.number().int(),
  notRenewed: z.array(z.object({ name: z.string(), plotLabel: z.string(), reason: z.string() })),
});

/** POST /api/clubs/:clubId/seasons: opens a season and sends the renewal e-mails. */
export function openSeason(clubId: number, body: SeasonCreateBody) {
  return apiFetch(`/api/clubs/${clubId}/seasons`, { method: 'POST', body, schema: OpenSeasonResultSchema });
}

/** Opens a season and refreshes the club's seasons. */
export function useOpenSeason(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SeasonCreateBody) => openSeason(clubId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: springRoundKeys.list({ clubId }) }),
  });
}
