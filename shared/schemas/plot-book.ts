import { z } from 'zod';
import { pestBySlug } from '../crops/pests';
import { dateWithinSchema, IdSchema, textSchema, VersionSchema } from './common';
import { PlotKindSchema } from './plots';
import { UnitsSchema } from './sites';
import { FindingSchema } from './findings';

// The plot book: plantings on a plot (or part of it), their harvests, and observations of pests and
// diseases with photos. Lengths in metres, weights stored in grams; dates are calendar dates.

export const plantingMethods = ['sown', 'transplanted'] as const;
export const PlantingMethodSchema = z.enum(plantingMethods);
export const plantingLayouts = ['rows', 'intensive'] as const;
export const PlantingLayoutSchema = z.enum(plantingLayouts);
export const plantingStatuses = ['planned', 'sown', 'up', 'harvesting', 'finished', 'failed'] as const;
export const PlantingStatusSchema = z.enum(plantingStatuses);
export const weightUnits = ['g', 'kg', 'oz', 'lb'] as const;
export const WeightUnitSchema = z.enum(weightUnits);
export const observationKinds = ['pest', 'disease', 'other'] as const;
export const ObservationKindSchema = z.enum(observationKinds);
export const severities = ['light', 'moderate', 'severe'] as const;
export const SeveritySchema = z.enum(severities);

/** The most photos one observation may carry. */
export const MAX_PHOTOS_PER_OBSERVATION = 4;

// The part columns keep millimetres, so anything under 1 cm a side is a slip rather than a bed.
const partOffset = z.number().finite().min(0, 'Cannot be negative').max(200, 'At most 200 m');
const partSide = z.number().finite().min(0.01, 'At least 1 cm').max(200, 'At most 200 m');

/** A rectangle inside the plot, in metres from the plot's own corner; whether it fits is checked against the plot. */
export const PlotPartSchema = z.strictObject({ x: partOffset, y: partOffset, width: partSide, length: partSide });
export type PlotPart = z.infer<typeof PlotPartSchema>;

const plantedOn = dateWithinSchema({ earliest: '2000-01-01', daysAhead: 400, message: 'Use a date like 2027-04-12', tooLateMessage: 'At most about a year ahead' });
const pastDate = (example: string) =>
  dateWithinSchema({ earliest: '2000-01-01', daysAhead: 0, message: `Use a date like ${example}`, tooLateMessage: 'Cannot be in the future' });

const plantingFields = {
  cropId: IdSchema,
  variety: textSchema({ max: 120 }),
  part: PlotPartSchema.nullable(),
  method: PlantingMethodSchema,
  plantedOn,
  layout: PlantingLayoutSchema,
  rowCount: z.number().int('A whole number of rows').min(1, 'At least 1 row').max(1000, 'At most 1000 rows').nullable(),
  quantity: z.number().int('A whole number of plants').min(1, 'At least 1').max(1_000_000, 'At most 1,000,000').nullable(),
  status: PlantingStatusSchema,
  notes: textSchema({ max: 2000, multiline: true }),
  /** Why the holder keeps the planting despite a clash the neighbour check found; needed when there is one. */
  keepReason: textSchema({ max: 500, multiline: true }).nullable(),
};

/** POST /api/plots/:plotId/plantings: crop, method and date are needed; the rest have defaults (whole plot, rows, planned). */
export const PlantingBodySchema = z.strictObject({
  cropId: plantingFields.cropId,
  variety: plantingFields.variety.default(''),
  part: plantingFields.part.default(null),
  method: plantingFields.method,
  plantedOn: plantingFields.plantedOn,
  layout: plantingFields.layout.default('rows'),
  rowCount: plantingFields.rowCount.default(null),
  quantity: plantingFields.quantity.default(null),
  status: plantingFields.status.default('planned'),
  notes: plantingFields.notes.default(''),
  keepReason: plantingFields.keepReason.default(null),
});
export type PlantingBody = z.infer<typeof PlantingBodySchema>;

/** POST /api/plots/:plotId/plantings/check: a planting as the form holds it, with `plantingId` when editing a saved one. */
export const PlantingCheckBodySchema = PlantingBodySchema.extend({ plantingId: IdSchema.nullable().default(null) });
export type PlantingCheckBody = z.infer<typeof PlantingCheckBodySchema>;

/** PATCH /api/plantings/:plantingId: any of the fields, with the version last read. */
export const PlantingUpdateBodySchema = z.strictObject({ version: VersionSchema, ...plantingFields }).partial().required({ version: true });
export type PlantingUpdateBody = z.infer<typeof PlantingUpdateBodySchema>;

const DateWindowSchema = z.object({ earliest: z.string(), latest: z.string() });

/** What the server works out for a planting from the crop notes, the part's size and the site. */
export const PlantingComputedSchema = z.object({
  areaM2: z.number(),
  /** At the wider end of each spacing range (the spacing plants end at after thinning); null when the crop has no spacing. */
  plantsThatFit: z
    .object({ plants: z.number().int(), rows: z.number().int(), perRow: z.number().int(), inRowCm: z.number(), betweenRowCm: z.number().nullable() })
    .nullable(),
  /** Soil temperature used for emergence (the site's table for the planting's month), °C; null falls back to the crop's range. */
  soilTempC: z.number().nullable(),
  emergence: DateWindowSchema.extend({ expected: z.string(), basis: z.enum(['table', 'range']) }).nullable(),
  thinning: z.string().nullable(),
  sideDressing: DateWindowSchema.nullable(),
  /** Null only when a club's own crop lacks the values the dates need (a warning says so). */
  harvestWindow: DateWindowSchema.extend({ countedFrom: z.enum(['sowing', 'transplanting']), allowanceDays: z.number() }).nullable(),
  warnings: z.array(z.looseObject({ kind: z.string(), message: z.string() })),
});
export type PlantingComputed = z.infer<typeof PlantingComputedSchema>;

export const PlantingCropSchema = z.object({ id: z.number().int(), slug: z.string(), commonName: z.string(), family: z.string() });

/** One planting as the API answers it. */
export const PlantingSchema = z.object({
  id: z.number().int(),
  plotId: z.number().int(),
  seasonId: z.number().int(),
  seasonYear: z.number().int(),
  crop: PlantingCropSchema,
  variety: z.string(),
  part: z.object({ x: z.number(), y: z.number(), width: z.number(), length: z.number() }).nullable(),
  method: PlantingMethodSchema,
  plantedOn: z.string(),
  layout: PlantingLayoutSchema,
  rowCount: z.number().int().nullable(),
  quantity: z.number().int().nullable(),
  status: PlantingStatusSchema,
  notes: z.string(),
  keepReason: z.string().nullable(),
  version: z.number().int(),
  computed: PlantingComputedSchema,
});
export type Planting = z.infer<typeof PlantingSchema>;

/** The heaviest single harvest accepted, in grams: 10 t, far past any plot, well inside the column. */
export const MAX_HARVEST_GRAMS = 10_000_000;

/** POST /api/plantings/:plantingId/harvests: a weight in any unit (stored as grams), a count of pieces, or both. */
export const HarvestBodySchema = z
  .strictObject({
    harvestedOn: pastDate('2027-07-02'),
    weight: z.strictObject({ value: z.number().finite().positive('Must be more than 0').max(MAX_HARVEST_GRAMS, 'Too heavy'), unit: WeightUnitSchema }).nullable().default(null),
    count: z.number().int('A whole number').min(1, 'At least 1').max(1_000_000, 'At most 1,000,000').nullable().default(null),
    notes: textSchema({ max: 2000, multiline: true }).default(''),
  })
  .superRefine((b, ctx) => {
    if (!b.weight && !b.count) ctx.addIssue({ code: 'custom', path: ['weight'], message: 'Give a weight, a count or both' });
  });
export type HarvestBody = z.infer<typeof HarvestBodySchema>;

export const HarvestSchema = z.object({
  id: z.number().int(),
  plantingId: z.number().int(),
  harvestedOn: z.string(),
  grams: z.number().nullable(),
  count: z.number().int().nullable(),
  notes: z.string(),
});
export type Harvest = z.infer<typeof HarvestSchema>;

/** POST /api/plots/:plotId/observations: a pest or disease from the list by slug (its name and kind come with it), or a name and kind. */
export const ObservationBodySchema = z
  .strictObject({
    pestSlug: z
      .string()
      .max(60, 'Not a pest or disease on the list')
      .refine((s) => pestBySlug(s) !== undefined, 'Not a pest or disease on the list')
      .nullable()
      .default(null),
    name: textSchema({ max: 120 }).nullable().default(null),
    kind: ObservationKindSchema.nullable().default(null),
    severity: SeveritySchema,
    observedOn: pastDate('2027-06-20'),
    notes: textSchema({ max: 2000, multiline: true }).default(''),
    plantingId: IdSchema.nullable().default(null),
    part: PlotPartSchema.nullable().default(null),
  })
  .superRefine((b, ctx) => {
    const pest = b.pestSlug ? pestBySlug(b.pestSlug) : undefined;
    if (!pest && !b.name) ctx.addIssue({ code: 'custom', path: ['name'], message: 'Choose a pest or disease, or give a name' });
    if (!pest && !b.kind) ctx.addIssue({ code: 'custom', path: ['kind'], message: 'Say whether it is a pest, a disease or something else' });
    if (pest && b.kind && b.kind !== pest.kind) ctx.addIssue({ code: 'custom', path: ['kind'], message: `${pest.name} is a ${pest.kind}` });
  });
export type ObservationBody = z.infer<typeof ObservationBodySchema>;

export const ObservationPhotoSchema = z.object({
  id: z.number().int(),
  url: z.string(),
  thumbUrl: z.string(),
  width: z.number().int(),
  height: z.number().int(),
});
export type ObservationPhoto = z.infer<typeof ObservationPhotoSchema>;

export const ObservationSchema = z.object({
  id: z.number().int(),
  plotId: z.number().int(),
  plantingId: z.number().int().nullable(),
  pestSlug: z.string().nullable(),
  name: z.string(),
  kind: ObservationKindSchema,
  /** Kept against the soil for the rotation rules. */
  isSoilBorne: z.boolean(),
  severity: SeveritySchema,
  observedOn: z.string(),
  notes: z.string(),
  part: z.object({ x: z.number(), y: z.number(), width: z.number(), length: z.number() }).nullable(),
  photos: z.array(ObservationPhotoSchema),
});
export type Observation = z.infer<typeof ObservationSchema>;

const TotalsSchema = z.object({
  grams: z.number(),
  count: z.number().int(),
  gramsPerM2: z.number().nullable(),
  countPerM2: z.number().nullable(),
  gramsPerPlant: z.number().nullable(),
  countPerPlant: z.number().nullable(),
});

/** ?year= picks the season shown; this season when left out. */
export const PlotBookQuerySchema = z.object({ year: z.coerce.number().int('A year like 2027').min(2000, 'From 2000').max(2100, 'Up to 2100').optional() });

/** GET /api/plots/:plotId/book: one season's plantings and harvests, the plot's earlier seasons and its observations. */
export const PlotBookSchema = z.object({
  plot: z.object({
    id: z.number().int(),
    label: z.string(),
    siteId: z.number().int(),
    siteName: z.string(),
    width: z.number(),
    length: z.number(),
    kind: PlotKindSchema,
    units: UnitsSchema,
  }),
  /** The season shown; null when the club has no season yet. */
  season: z.object({ id: z.number().int(), year: z.number().int(), isCurrent: z.boolean() }).nullable(),
  /** Whether the asker may add and change entries (the holder this season, or a coordinator). */
  canWrite: z.boolean(),
  plantings: z.array(PlantingSchema),
  harvests: z.array(HarvestSchema),
  pastSeasons: z.array(z.object({ year: z.number().int(), plantings: z.array(PlantingSchema) })),
  /** Every observation of the plot, newest first: they belong to the soil's history. */
  observations: z.array(ObservationSchema),
  /** The neighbour check's findings for the season's plantings (see shared/schemas/findings.ts). */
  findings: z.array(FindingSchema),
  harvestTotals: z.object({
    byPlanting: z.array(TotalsSchema.extend({ plantingId: z.number().int() })),
    plot: TotalsSchema,
  }),
});
export type PlotBook = z.infer<typeof PlotBookSchema>;
