import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invalidateTaskLists } from './invalidate';
import { postTaskStatus, type TaskStatusBody } from './task-status';

/** POST /api/tasks/:taskId/reopen {version, note}: undoes done or not needed; the task is open again. */
export function reopenTask(taskId: number, body: TaskStatusBody) {
  return postTaskStatus(taskId, 'reopen', body);
}

/** Opens a finished task again and reads the lists again, after a 409 too. */
export function useReopenTask() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ taskId, body }: { taskId: number; body: TaskStatusBody }) => reopenTask(taskId, body),
    onSettled: () => invalidateTaskLists(queryClient),
  });
}
