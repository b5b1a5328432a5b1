import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invalidateTaskLists } from './invalidate';
import { postTaskStatus, type TaskStatusBody } from './task-status';

/** POST /api/tasks/:taskId/skip {version, note}: the task is not needed this time. */
export function skipTask(taskId: number, body: TaskStatusBody) {
  return postTaskStatus(taskId, 'skip', body);
}

/** Marks a task not needed and reads the lists again, after a 409 too. */
export function useSkipTask() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ taskId, body }: { taskId: number; body: TaskStatusBody }) => skipTask(taskId, body),
    onSettled: () => invalidateTaskLists(queryClient),
  });
}
