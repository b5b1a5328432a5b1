/** Query keys for sites: `['sites']`, `['sites', 'list', { clubId }]`, `['sites', 'detail', id]`. */
export const sitesKeys = {
  all: ['sites'] as const,
  lists: () => [...sitesKeys.all, 'list'] as const,
  list: (filters: { clubId: number }) => [...sitesKeys.lists(), filters] as const,
  details: () => [...sitesKeys.all, 'detail'] as const,
  detail: (id: number) => [...sitesKeys.details(), id] as const,
};
