import type { FindingKindSchema, FindingSeveritySchema } from '@shared/schemas/findings';
import type { z } from 'zod';

/** The coordinator's filters of the club's findings table; left out = every one. */
export interface ClubFindingFilters {
  clubId: number;
  seasonId?: number;
  siteId?: number;
  severity?: z.infer<typeof FindingSeveritySchema>;
  kind?: z.infer<typeof FindingKindSchema>;
}

/**
 * Query keys for the coordinator's neighbour check: `['club-findings', 'club', filters]` for the
 * club's table and `['club-findings', 'site', { siteId, seasonId }]` for one site's map.
 */
export const clubFindingsKeys = {
  all: ['club-findings'] as const,
  club: (filters: ClubFindingFilters) => [...clubFindingsKeys.all, 'club', filters] as const,
  site: (filters: { siteId: number; seasonId: number }) => [...clubFindingsKeys.all, 'site', filters] as const,
};
