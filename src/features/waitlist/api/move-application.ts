import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { WaitlistEntrySchema, type WaitlistMoveBodySchema } from '@shared/schemas/applications';
import { apiFetch } from '@/lib/api/client';
import { waitlistKeys } from './keys';

export type WaitlistMoveBody = z.infer<typeof WaitlistMoveBodySchema>;

/** POST /api/applications/:id/move: a new place in the queue, with the reason kept. */
export function moveApplication(applicationId: number, body: WaitlistMoveBody) {
  return apiFetch(`/api/applications/${applicationId}/move`, { method: 'POST', body, schema: WaitlistEntrySchema });
}

/** Moves someone in the queue and refreshes every waiting list view and their history. */
export function useMoveApplication() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ applicationId, body }: { applicationId: number; body: WaitlistMoveBody }) =>
      moveApplication(applicationId, body),
    onSuccess: (_entry, { applicationId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: waitlistKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: waitlistKeys.history(applicationId) }),
      ]),
  });
}
