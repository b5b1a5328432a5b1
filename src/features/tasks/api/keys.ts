import type { SiteTaskFilters } from '../lib/filters';

/**
 * Query keys for tasks: `['tasks', 'plot', plotId]` for a plot book's panel, `['tasks', 'site', siteId, filters]` for
 * the coordinators' table, `['tasks', 'run', runId]` for a generator run and `['tasks', 'water', siteId, weeks]`.
 * Changing a task invalidates `['tasks', 'plot']` and `['tasks', 'site']`, so every list showing it reads it again.
 */
export const tasksKeys = {
  all: ['tasks'] as const,
  plots: () => [...tasksKeys.all, 'plot'] as const,
  plot: (plotId: number) => [...tasksKeys.plots(), plotId] as const,
  sites: () => [...tasksKeys.all, 'site'] as const,
  site: (siteId: number) => [...tasksKeys.sites(), siteId] as const,
  siteList: (siteId: number, filters: SiteTaskFilters) => [...tasksKeys.site(siteId), filters] as const,
  run: (runId: number) => [...tasksKeys.all, 'run', runId] as const,
  water: (siteId: number, weeks: number) => [...tasksKeys.all, 'water', siteId, weeks] as const,
};
