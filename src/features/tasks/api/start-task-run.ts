import { useMutation, useQueryClient } from '@tanstack/react-query';
import { TaskRunSchema } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';
import { tasksKeys } from './keys';

/** POST /api/sites/:siteId/task-runs (no body; 202): works the site's tasks out again from its plantings now. */
export function startTaskRun(siteId: number) {
  return apiFetch(`/api/sites/${siteId}/task-runs`, { method: 'POST', schema: TaskRunSchema });
}

/** Starts a run and seeds its progress query with the answer, so the bar shows at once. */
export function useStartTaskRun(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => startTaskRun(siteId),
    onSuccess: (run) => queryClient.setQueryData(tasksKeys.run(run.id), run),
  });
}
