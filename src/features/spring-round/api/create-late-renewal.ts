import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

/** POST /api/seasons/:seasonId/late-renewals: e-mails a renewal to a holder who was left out and has paid since. */
export function createLateRenewal(seasonId: number, allocationId: number) {
  return apiFetch(`/api/seasons/${seasonId}/late-renewals`, {
    method: 'POST',
    body: { allocationId },
    schema: z.object({ sentTo: z.string() }),
  });
}

export function useCreateLateRenewal(seasonId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (allocationId: number) => createLateRenewal(seasonId, allocationId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: springRoundKeys.all }),
  });
}
