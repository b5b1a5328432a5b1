import { z } from 'zod';
import { dateWithinSchema, IdTextSchema } from './common';

// The neighbour check over HTTP: findings of plantings, a dry run of a planting before it is saved,
// "what fits here" for a plot, and the coordinator's table for a season.

export const findingSeverities = ['clash', 'watch', 'good'] as const;
export const FindingSeveritySchema = z.enum(findingSeverities);
export const findingKinds = ['rotation', 'companion', 'shade', 'site_fit'] as const;
export const FindingKindSchema = z.enum(findingKinds);

const FindingPeerSchema = z.object({
  plantingId: z.number().int(),
  plotId: z.number().int(),
  plotLabel: z.string(),
  cropName: z.string(),
  seasonYear: z.number().int(),
});

/** One finding as the API answers it (see shared/findings/types.ts). */
export const FindingSchema = z.object({
  key: z.string(),
  severity: FindingSeveritySchema,
  kind: FindingKindSchema,
  rule: z.string(),
  title: z.string(),
  message: z.string(),
  plantingId: z.number().int(),
  plotId: z.number().int(),
  plotLabel: z.string(),
  cropName: z.string(),
  seasonYear: z.number().int(),
  peers: z.array(FindingPeerSchema),
  source: z.object({ id: z.string(), title: z.string(), evidence: z.string(), url: z.string().optional() }),
  numbers: z.record(z.string(), z.number()),
  /** The holder's reason for keeping the planting despite a clash, when one was given. */
  keptReason: z.string().nullable(),
});
export type FindingView = z.infer<typeof FindingSchema>;

/** The answer to POST /api/plots/:plotId/plantings/check (its body: PlantingCheckBodySchema in plot-book.ts). */
export const PlantingCheckResultSchema = z.object({ findings: z.array(FindingSchema) });

/** GET /api/plots/:plotId/what-fits?date=&x=&y=&width=&length= (the part is optional). */
export const WhatFitsItemSchema = z.object({
  crop: z.object({ id: z.number().int(), slug: z.string(), commonName: z.string(), family: z.string() }),
  /** good: a good pairing and nothing against; fine: nothing found; watch; clash. */
  verdict: z.enum(['good', 'fine', 'watch', 'clash']),
  score: z.number(),
  findings: z.array(FindingSchema),
});
export const WhatFitsResultSchema = z.object({ date: z.string(), items: z.array(WhatFitsItemSchema) });
export type WhatFitsResult = z.infer<typeof WhatFitsResultSchema>;

/** GET /api/sites/:siteId/findings?seasonId= (coordinators) and GET /api/clubs/:clubId/findings?seasonId=&siteId=&severity=&kind= */
export const SiteFindingSchema = FindingSchema.extend({ siteId: z.number().int(), siteName: z.string() });
export const FindingListSchema = z.object({ seasonId: z.number().int().nullable(), seasonYear: z.number().int().nullable(), items: z.array(SiteFindingSchema) });
export type FindingList = z.infer<typeof FindingListSchema>;

const isoDate = dateWithinSchema({ earliest: '2000-01-01', daysAhead: 800, message: 'Use a date like 2027-04-12', tooLateMessage: 'At most about two years ahead' });
const metres = z.coerce.number('A length in metres').finite('A length in metres').min(0, 'Cannot be negative').max(200, 'At most 200 m');

/** Query of GET /api/plots/:plotId/what-fits: a sowing date and, optionally, all four sides of a part. */
export const WhatFitsQuerySchema = z
  .object({ date: isoDate, x: metres.optional(), y: metres.optional(), width: metres.optional(), length: metres.optional() })
  .refine((q) => [q.x, q.y, q.width, q.length].every((v) => v === undefined) || [q.x, q.y, q.width, q.length].every((v) => v !== undefined), {
    message: 'Give x, y, width and length of the part, or none of them',
    path: ['width'],
  })
  .refine((q) => q.width === undefined || (q.width >= 0.01 && (q.length ?? 0) >= 0.01), { message: 'At least 1 cm a side', path: ['width'] });
export type WhatFitsQuery = z.infer<typeof WhatFitsQuerySchema>;

/** Query of the coordinators' findings lists; the season defaults to the club's current one. */
export const FindingListQuerySchema = z.object({
  seasonId: IdTextSchema.optional(),
  siteId: IdTextSchema.optional(),
  severity: FindingSeveritySchema.optional(),
  kind: FindingKindSchema.optional(),
});
export type FindingListQuery = z.infer<typeof FindingListQuerySchema>;
