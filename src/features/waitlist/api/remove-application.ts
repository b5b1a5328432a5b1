import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { WaitlistEntrySchema, type ApplicationRemoveBodySchema } from '@shared/schemas/applications';
import { apiFetch } from '@/lib/api/client';
import { waitlistKeys } from './keys';

export type ApplicationRemoveBody = z.infer<typeof ApplicationRemoveBodySchema>;

/** POST /api/applications/:id/remove: takes someone off the waiting list, keeping the reason. */
export function removeApplication(applicationId: number, body: ApplicationRemoveBody) {
  return apiFetch(`/api/applications/${applicationId}/remove`, { method: 'POST', body, schema: WaitlistEntrySchema });
}

/** Removes someone from the waiting list and refreshes every waiting list view and their history. */
export function useRemoveApplication() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ applicationId, body }: { applicationId: number; body: ApplicationRemoveBody }) =>
      removeApplication(applicationId, body),
    onSuccess: (_entry, { applicationId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: waitlistKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: waitlistKeys.history(applicationId) }),
      ]),
  });
}
