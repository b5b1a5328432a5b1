import type { QueryClient } from '@tanstack/react-query';
import { tasksKeys } from './keys';

/** Reads every plot book panel and site table again after a task, a handover or a run changed something. */
export function invalidateTaskLists(queryClient: QueryClient) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: tasksKeys.plots() }),
    queryClient.invalidateQueries({ queryKey: tasksKeys.sites() }),
  ]);
}
