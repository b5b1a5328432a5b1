import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { invalidateTaskLists } from './invalidate';

/** DELETE /api/handovers/:handoverId (204): the holder is not away after all; the tasks come back to them. */
export function deleteHandover(handoverId: number) {
  return apiFetch(`/api/handovers/${handoverId}`, { method: 'DELETE' });
}

/** Cancels a handover and reads the tasks again. */
export function useDeleteHandover() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (handoverId: number) => deleteHandover(handoverId),
    onSuccess: () => invalidateTaskLists(queryClient),
  });
}
