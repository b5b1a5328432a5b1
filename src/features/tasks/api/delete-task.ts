import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { invalidateTaskLists } from './invalidate';

/** DELETE /api/tasks/:taskId (204; coordinator-added tasks only). */
export function deleteTask(taskId: number) {
  return apiFetch(`/api/tasks/${taskId}`, { method: 'DELETE' });
}

/** Removes a coordinator's task and reads the lists again. */
export function useDeleteTask() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (taskId: number) => deleteTask(taskId),
    onSettled: () => invalidateTaskLists(queryClient),
  });
}
