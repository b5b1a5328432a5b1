import { z } from 'zod';
import { FindingKindSchema } from './findings';
import { UnitsSchema } from './sites';

// The coordinator's season at a glance: counts only, each from the same rule as the page it links to.

/** Plots of one live site by where they stand in the club's newest season (the spring round's states). */
export const SiteSummarySchema = z.object({
  siteId: z.number().int(),
  name: z.string(),
  free: z.number().int(),
  offered: z.number().int(),
  /** Waiting for a holder's renewal answer. */
  renewalPending: z.number().int(),
  taken: z.number().int(),
});
export type SiteSummary = z.infer<typeof SiteSummarySchema>;

/** Places on the shifts (not called off) of one Monday-to-Sunday week of the sites' dates. */
export const WeekCoverageSchema = z.object({
  /** The Monday, YYYY-MM-DD. */
  weekStart: z.string(),
  shifts: z.number().int(),
  places: z.number().int(),
  /** Places taken or done, at most each shift's places. */
  taken: z.number().int(),
});
export type WeekCoverage = z.infer<typeof WeekCoverageSchema>;

export const SeasonSummarySchema = z.object({
  /** The club's newest season (plots and fees); null for a club with none. */
  season: z.object({ id: z.number().int(), year: z.number().int() }).nullable(),
  sites: z.array(SiteSummarySchema),
  /** The newest season's fees, as the fees page totals them, in the club's currency's minor units. */
  fees: z.object({ currency: z.string(), dueMinor: z.number().int(), paidMinor: z.number().int(), refundedMinor: z.number().int(), count: z.number().int() }),
  /** This week and the three after it, in the club's zone. */
  shiftWeeks: z.array(WeekCoverageSchema),
  /** The growing season under way (the findings page's and harvest figures' season). */
  findingsSeasonYear: z.number().int().nullable(),
  findings: z.array(z.object({ kind: FindingKindSchema, count: z.number().int() })),
  /** The harvest figures' club totals; `units` is the main site's, for showing the weight. */
  harvest: z.object({ seasonYear: z.number().int().nullable(), grams: z.number(), count: z.number().int(), plantings: z.number().int(), units: UnitsSchema }),
});
export type SeasonSummary = z.infer<typeof SeasonSummarySchema>;
