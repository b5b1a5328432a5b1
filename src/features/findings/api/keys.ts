import type { PlantingCheckInput } from './check-planting';
import type { WhatFitsQuery } from './get-what-fits';

/**
 * Query keys for the neighbour check: `['findings', 'plot', plotId, 'check', draft]` for a dry run and
 * `['findings', 'plot', plotId, 'what-fits', query]`; invalidating `plot(plotId)` refreshes both.
 */
export const findingsKeys = {
  all: ['findings'] as const,
  plot: (plotId: number) => [...findingsKeys.all, 'plot', plotId] as const,
  check: (plotId: number, draft: PlantingCheckInput | null) => [...findingsKeys.plot(plotId), 'check', draft] as const,
  whatFits: (plotId: number, query: WhatFitsQuery | null) => [...findingsKeys.plot(plotId), 'what-fits', query] as const,
};
