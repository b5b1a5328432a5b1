/** Query keys for the weather log: `['weather']`, `['weather', 'log', { siteId, from, to }]`, `['weather', 'sites', clubId]`. */
export const weatherKeys = {
  all: ['weather'] as const,
  logs: () => [...weatherKeys.all, 'log'] as const,
  /** Every range read of one site's log. */
  site: (siteId: number) => [...weatherKeys.logs(), { siteId }] as const,
  log: (filters: { siteId: number; from?: string; to?: string }) => [...weatherKeys.logs(), filters] as const,
  sites: (clubId: number) => [...weatherKeys.all, 'sites', clubId] as const,
};
