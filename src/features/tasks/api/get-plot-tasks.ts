import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { PlotTasksShape } from '@/lib/api/response-shapes.gen';
import { tasksKeys } from './keys';

/** GET /api/plots/:plotId/tasks: the plot's open tasks grouped for its plot book, the last done ones and its handovers. */
export function getPlotTasks(plotId: number, signal?: AbortSignal) {
  return apiFetch(`/api/plots/${plotId}/tasks`, { schema: PlotTasksShape, signal });
}

/** Query options for one plot's tasks. */
export function plotTasksQueryOptions(plotId: number) {
  return queryOptions({ queryKey: tasksKeys.plot(plotId), queryFn: ({ signal }) => getPlotTasks(plotId, signal) });
}

/** One plot's tasks; `enabled: false` asks nothing (an earlier season's plot book). */
export function usePlotTasks(plotId: number, { enabled = true, retry }: { enabled?: boolean; retry?: boolean } = {}) {
  return useQuery({ ...plotTasksQueryOptions(plotId), enabled: enabled && plotId > 0, ...(retry === undefined ? {} : { retry }) });
}
