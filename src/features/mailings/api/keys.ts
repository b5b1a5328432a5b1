/** Query keys for club messages: `['mailings', 'list', { clubId }]`, `['mailings', 'audience', { clubId, …audience }]`, `['mailings', 'preferences', { clubId }]`, `['mailings', 'stop', token]`. */
export const mailingsKeys = {
  all: ['mailings'] as const,
  lists: () => [...mailingsKeys.all, 'list'] as const,
  list: (filters: { clubId: number }) => [...mailingsKeys.lists(), filters] as const,
  audience: (filters: { clubId: number; kind: string; year?: number; siteId?: number }) => [...mailingsKeys.all, 'audience', filters] as const,
  preferences: (filters: { clubId: number }) => [...mailingsKeys.all, 'preferences', filters] as const,
  stop: (token: string) => [...mailingsKeys.all, 'stop', token] as const,
};
