/** Query keys for plot books: `['plot-book', 'detail', { plotId, year }]` and `['plot-book', 'crop-options', clubId]`. */
export const plotBookKeys = {
  all: ['plot-book'] as const,
  details: () => [...plotBookKeys.all, 'detail'] as const,
  /** Every season's view of one plot's book. */
  plot: (plotId: number) => [...plotBookKeys.details(), { plotId }] as const,
  detail: (filters: { plotId: number; year?: number }) => [...plotBookKeys.details(), filters] as const,
  /** The severities of a plot's findings this season, for the holder's home (a lighter check than the book's). */
  severities: (plotId: number) => [...plotBookKeys.all, 'severities', plotId] as const,
  cropOptions: (clubId: number) => [...plotBookKeys.all, 'crop-options', clubId] as const,
};
