import type { QueryClient } from '@tanstack/react-query';
import { tasksKeys } from './keys';

/** Reads every plot book panel and site table again after a task, a handover or a run changed something. */
export function invalidateTaskLists(queryClient: QueryClient) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: tasksKeys.plots() }),
    queryClient.invalidateQueries({ queryKey: tasksKeys.sites() }),
  ]);
}

/** After a write the server re-plans tasks with (weather, plantings): every task list and the water summaries are read again. */
export function invalidateAfterReplan(queryClient: QueryClient) {
  return Promise.all([invalidateTaskLists(queryClient), queryClient.invalidateQueries({ queryKey: [...tasksKeys.all, 'water'] })]);
}
