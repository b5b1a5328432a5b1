import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { SiteTaskListSchema } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';
import { filtersQuery, type SiteTaskFilters } from '../lib/filters';
import { tasksKeys } from './keys';

/** GET /api/sites/:siteId/tasks?from=&to=&kind=&plotId=&status= (coordinators): the site's tasks with the table's filters. */
export function getSiteTasks(siteId: number, filters: SiteTaskFilters, signal?: AbortSignal) {
  return apiFetch(`/api/sites/${siteId}/tasks${filtersQuery(filters)}`, { schema: SiteTaskListSchema, signal });
}

/** GET /api/sites/:siteId/tasks.csv with the same filters: the table as a CSV download. */
export function siteTasksCsvUrl(siteId: number, filters: SiteTaskFilters): string {
  return `/api/sites/${siteId}/tasks.csv${filtersQuery(filters)}`;
}

/** Query options for a site's tasks with the table's filters. */
export function siteTasksQueryOptions(siteId: number, filters: SiteTaskFilters) {
  return queryOptions({ queryKey: tasksKeys.siteList(siteId, filters), queryFn: ({ signal }) => getSiteTasks(siteId, filters, signal) });
}

/** A site's tasks; while other filters load, the last answer stays on screen. `enabled: false` asks nothing (filters the server would refuse). */
export function useSiteTasks(siteId: number, filters: SiteTaskFilters, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...siteTasksQueryOptions(siteId, filters), placeholderData: keepPreviousData, enabled });
}
