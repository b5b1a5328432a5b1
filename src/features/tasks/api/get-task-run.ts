import { useQuery } from '@tanstack/react-query';
import { TaskRunSchema } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';
import { runIsActive } from '../lib/runs';
import { tasksKeys } from './keys';

/** How often a run still going is asked about. */
export const RUN_POLL_MS = 1000;

/** GET /api/task-runs/:runId: how far a run got. */
export function getTaskRun(runId: number, signal?: AbortSignal) {
  return apiFetch(`/api/task-runs/${runId}`, { schema: TaskRunSchema, signal });
}

/** A run, asked about about once a second while it is queued or running; null asks nothing. */
export function useTaskRun(runId: number | null) {
  return useQuery({
    queryKey: tasksKeys.run(runId ?? 0),
    queryFn: ({ signal }) => getTaskRun(runId!, signal),
    enabled: runId !== null,
    refetchInterval: (query) => (query.state.data && runIsActive(query.state.data) ? RUN_POLL_MS : false),
    // A run is read again only by the poll, not when the window regains focus after it finished.
    staleTime: Infinity,
  });
}
