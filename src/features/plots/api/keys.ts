/** Query keys for plots: `['plots']`, `['plots', 'list', { siteId }]`, `['plots', 'neighbours', { siteId }]`, `['plots', 'detail', id]`, `['plots', 'mine', clubId]`. */
export const plotsKeys = {
  all: ['plots'] as const,
  lists: () => [...plotsKeys.all, 'list'] as const,
  list: (filters: { siteId: number }) => [...plotsKeys.lists(), filters] as const,
  neighbours: (filters: { siteId: number }) => [...plotsKeys.all, 'neighbours', filters] as const,
  details: () => [...plotsKeys.all, 'detail'] as const,
  detail: (id: number) => [...plotsKeys.details(), id] as const,
  mine: (clubId: number) => [...plotsKeys.all, 'mine', clubId] as const,
};
