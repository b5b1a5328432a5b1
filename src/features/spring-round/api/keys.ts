/** Query keys for the spring round: seasons of a club, one season, plot states of a site in a season, link previews. */
export const springRoundKeys = {
  all: ['spring-round'] as const,
  lists: () => [...springRoundKeys.all, 'list'] as const,
  list: (filters: { clubId: number }) => [...springRoundKeys.lists(), filters] as const,
  details: () => [...springRoundKeys.all, 'detail'] as const,
  detail: (id: number) => [...springRoundKeys.details(), id] as const,
  plotStates: (filters: { seasonId: number; siteId: number }) => [...springRoundKeys.all, 'plot-states', filters] as const,
  leftOut: (seasonId: number) => [...springRoundKeys.all, 'left-out', seasonId] as const,
  link: (filters: { kind: 'offer' | 'renewal' } & ({ token: string } | { renewalId: number })) => [...springRoundKeys.all, 'link', filters] as const,
};
