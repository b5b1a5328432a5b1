import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invalidateTaskLists } from './invalidate';
import { postTaskStatus, type TaskStatusBody } from './task-status';

/** POST /api/tasks/:taskId/done {version, note}: the task is done, with an optional note. */
export function markTaskDone(taskId: number, body: TaskStatusBody, idempotencyKey?: string) {
  return postTaskStatus(taskId, 'done', body, idempotencyKey);
}

/** Marks a task done and reads the lists again, after a 409 too (so the page shows the task as it is now). */
export function useMarkTaskDone() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ taskId, body, key }: { taskId: number; body: TaskStatusBody; key?: string }) => markTaskDone(taskId, body, key),
    onSettled: () => invalidateTaskLists(queryClient),
  });
}
