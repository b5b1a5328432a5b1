import { z } from 'zod';
import { csvFileSchema, dateWithinSchema, textSchema, VersionSchema } from './common';
import { PlotSeasonStateSchema } from './seasons';

import { plotKinds } from './labels';

export { plotKindLabels, plotKinds } from './labels';
export const PlotKindSchema = z.enum(plotKinds);
export type PlotKind = z.infer<typeof PlotKindSchema>;

export const sunValues = ['full', 'part', 'shade'] as const;
export const SunSchema = z.enum(sunValues);
export type Sun = z.infer<typeof SunSchema>;
export const sunLabels: Record<Sun, string> = { full: 'Full sun', part: 'Part shade', shade: 'Shade' };

const metres = (max: number) => z.number().finite().min(0, 'Cannot be negative').max(max, `At most ${max} m`);

/** The shortest side a plot may have, in metres: a small container is wider than this (common practice). */
export const MIN_PLOT_SIDE_M = 0.1;
/** The longest side a plot may have, in metres. */
export const MAX_PLOT_SIDE_M = 200;
const plotSide = () =>
  z
    .number()
    .finite()
    .min(0, 'Cannot be negative')
    .refine((v) => v > 0, 'Must be more than 0')
    .min(MIN_PLOT_SIDE_M, `At least ${MIN_PLOT_SIDE_M} m`)
    .max(MAX_PLOT_SIDE_M, `At most ${MAX_PLOT_SIDE_M} m`);

const plotFields = {
  label: z
    .string()
    .trim()
    .min(1, 'Enter a label')
    .max(20, 'At most 20 characters')
    .regex(/^[\p{L}\p{N}][\p{L}\p{N} ._-]*$/u, 'Letters, digits, space, dot, dash or underscore'),
  x: metres(2000),
  y: metres(2000),
  width: plotSide(),
  length: plotSide(),
  rotation: z.union([z.literal(0), z.literal(90)], { message: 'Rotation is 0 or 90' }),
  kind: PlotKindSchema,
  // Kept to the centimetre, so less than 1 cm would be stored as 0.
  soilDepth: z.number().min(0.01, 'At least 1 cm').max(5, 'At most 5 m').nullable(),
  soilPh: z.number().min(3, 'pH is between 3 and 10').max(10, 'pH is between 3 and 10').nullable(),
  soilTestedOn: dateWithinSchema({
    earliest: '1900-01-01',
    daysAhead: 0,
    message: 'Use a date like 2026-04-12',
    tooLateMessage: 'Cannot be in the future',
  }).nullable(),
  sun: SunSchema,
  isAccessible: z.boolean(),
  hasWaterTap: z.boolean(),
  notes: textSchema({ max: 2000, multiline: true }),
};

/** Everything a coordinator sets on a new plot; lengths in metres, (x, y) its north-west corner on the site map. */
export const PlotCreateBodySchema = z.strictObject({
  ...plotFields,
  rotation: plotFields.rotation.default(0),
  kind: plotFields.kind.default('in_ground'),
  soilDepth: plotFields.soilDepth.default(null),
  soilPh: plotFields.soilPh.default(null),
  soilTestedOn: plotFields.soilTestedOn.default(null),
  sun: plotFields.sun.default('full'),
  isAccessible: plotFields.isAccessible.default(false),
  hasWaterTap: plotFields.hasWaterTap.default(false),
  notes: plotFields.notes.default(''),
});
export type PlotCreateBody = z.infer<typeof PlotCreateBodySchema>;

/** A change to a plot: any fields, plus the version the editor last saw (optimistic concurrency). */
export const PlotUpdateBodySchema = z
  .strictObject(plotFields)
  .partial()
  .extend({ version: VersionSchema });
export type PlotUpdateBody = z.infer<typeof PlotUpdateBodySchema>;

export const PlotSchema = z.object({
  id: z.number().int(),
  siteId: z.number().int(),
  label: z.string(),
  x: z.number(),
  y: z.number(),
  width: z.number(),
  length: z.number(),
  rotation: z.union([z.literal(0), z.literal(90)]),
  kind: PlotKindSchema,
  area: z.number(),
  soilDepth: z.number().nullable(),
  soilPh: z.number().nullable(),
  soilTestedOn: z.string().nullable(),
  sun: SunSchema,
  isAccessible: z.boolean(),
  hasWaterTap: z.boolean(),
  notes: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Plot = z.infer<typeof PlotSchema>;

export const PlotEventSchema = z.object({
  id: z.number().int(),
  kind: z.string(),
  summary: z.string(),
  details: z.record(z.string(), z.unknown()),
  byName: z.string().nullable(),
  at: z.string(),
});
export type PlotEvent = z.infer<typeof PlotEventSchema>;

export const PlotDetailSchema = PlotSchema.extend({
  siteName: z.string(),
  units: z.enum(['metric', 'us']),
  /** Who holds the plot in the club's newest season, when the viewer may see it. */
  holder: z.object({ userId: z.number().int(), name: z.string(), season: z.number().int() }).nullable(),
  /** Where the plot stands in the club's newest season (as on the season map, for this viewer); null before any season. */
  season: z.object({ year: z.number().int(), state: PlotSeasonStateSchema }).nullable(),
  neighbours: z.array(
    z.object({ plotId: z.number().int(), label: z.string(), kind: z.string(), side: z.string(), gap: z.number() }),
  ),
  history: z.array(PlotEventSchema),
});
export type PlotDetail = z.infer<typeof PlotDetailSchema>;

export const NeighbourPairSchema = z.object({
  a: z.number().int(),
  b: z.number().int(),
  kind: z.enum(['touching', 'across_path']),
  gap: z.number(),
  side: z.enum(['north', 'south', 'east', 'west']),
  facing: z.number(),
});
export type NeighbourPair = z.infer<typeof NeighbourPairSchema>;

/** One row of a plot CSV import, as read from the file (strings), before validation. */
export const plotCsvColumns = [
  'label',
  'x',
  'y',
  'width',
  'length',
  'rotation',
  'kind',
  'soil_depth',
  'soil_ph',
  'soil_tested_on',
  'sun',
  'accessible',
  'water_tap',
  'notes',
] as const;

export const PlotImportBodySchema = z.strictObject({
  csv: csvFileSchema(2_000_000, 'The file is larger than 2 MB'),
  /** Lengths in the file are in these units. */
  units: z.enum(['metric', 'us']),
  /** false: check and preview only; true: check and save all rows or none. */
  commit: z.boolean(),
});
export type PlotImportBody = z.infer<typeof PlotImportBodySchema>;

export const PlotImportResultSchema = z.object({
  rows: z.array(z.object({ row: z.number().int(), label: z.string(), plot: PlotCreateBodySchema.nullable() })),
  errors: z.array(z.object({ row: z.number().int(), field: z.string(), message: z.string() })),
  committed: z.boolean(),
  created: z.number().int(),
});
export type PlotImportResult = z.infer<typeof PlotImportResultSchema>;
