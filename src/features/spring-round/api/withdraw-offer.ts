import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

/** POST /api/offers/:offerId/withdraw: takes back an open offer. */
export function withdrawOffer(offerId: number) {
  return apiFetch<void>(`/api/offers/${offerId}/withdraw`, { method: 'POST' });
}

/** Withdraws an offer and refreshes the season. */
export function useWithdrawOffer(onDone?: () => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (offerId: number) => withdrawOffer(offerId),
    onSettled: async () => {
      await Promise.all([queryClient.invalidateQueries({ queryKey: springRoundKeys.all }), onDone?.()]);
    },
  });
}
