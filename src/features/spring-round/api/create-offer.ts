import { useMutation, useQueryClient } from '@tanstack/react-query';
import { OfferSchema, type OfferCreateBody } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { useIdempotencyKeys } from '@/lib/api/idempotency';
import { springRoundKeys } from './keys';

/** POST /api/seasons/:seasonId/offers: offers a free plot to someone on the waiting list (e-mails them). */
export function createOffer(seasonId: number, body: OfferCreateBody, idempotencyKey?: string) {
  return apiFetch(`/api/seasons/${seasonId}/offers`, { method: 'POST', body, schema: OfferSchema, idempotencyKey });
}

/** Makes an offer, then refreshes the season's plot states and counts (and, through onDone, the waiting list). */
export function useCreateOffer(seasonId: number, onDone?: () => Promise<unknown>) {
  const queryClient = useQueryClient();
  const keys = useIdempotencyKeys();
  return useMutation({
    mutationFn: (body: OfferCreateBody) => createOffer(seasonId, body, keys.keyFor(body)),
    onSuccess: (_offer, body) => keys.succeeded(body),
    onSettled: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: [...springRoundKeys.all, 'plot-states'] }),
        queryClient.invalidateQueries({ queryKey: springRoundKeys.lists() }),
        onDone?.(),
      ]);
    },
  });
}
