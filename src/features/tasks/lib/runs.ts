import type { TaskRun } from '@shared/schemas/tasks';

/** Whether the run is still going, so the page keeps asking how far it got. */
export function runIsActive(run: Pick<TaskRun, 'status'>): boolean {
  return run.status === 'queued' || run.status === 'running';
}

/**
 * "312 of 480 plantings" ("1 of 1 planting"); "Waiting to start" before the run knows its total; "No plantings to
 * read" for a finished run on a site with none.
 */
export function runProgressText(run: Pick<TaskRun, 'status' | 'done' | 'total'>): string {
  if (run.status === 'queued' && run.total === 0) return 'Waiting to start';
  if (run.status === 'done' && run.total === 0) return 'No plantings to read';
  return `${run.done} of ${run.total} ${run.total === 1 ? 'planting' : 'plantings'}`;
}

/** The share done, 0 to 100, whole; 100 for a finished run with nothing to read. */
export function runPercent(run: Pick<TaskRun, 'status' | 'done' | 'total'>): number {
  if (run.total <= 0) return run.status === 'done' ? 100 : 0;
  return Math.min(100, Math.max(0, Math.floor((run.done / run.total) * 100)));
}

/**
 * What a finished run changed, from its counts: "Done: 20 tasks added, 5 moved, 2 removed" ("1 task added");
 * "Done: nothing needed changing" when every count is 0.
 */
export function runSummary(run: Pick<TaskRun, 'created' | 'updated' | 'removed'>): string {
  if (run.created === 0 && run.updated === 0 && run.removed === 0) return 'Done: nothing needed changing';
  return `Done: ${run.created} ${run.created === 1 ? 'task' : 'tasks'} added, ${run.updated} moved, ${run.removed} removed`;
}
