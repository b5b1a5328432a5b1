import { z } from 'zod';
import { pestsAndDiseases } from '../crops/pests';
import type { Crop } from '../crops/types';
import { IdSchema, IdTextSchema, MAX_INT4, textSchema } from './common';

// The crop notes API: reference crops (shared/crops, loaded into the database at start), a club's own
// crops, its overrides of single reference values and its own relations between crops. Every value
// of the trade travels with its source, as in shared/crops/types.ts.

export const cropKinds = ['root', 'leaf', 'fruiting', 'legume', 'allium', 'brassica', 'herb', 'flower'] as const;
export const CropKindSchema = z.enum(cropKinds, { message: `One of ${cropKinds.join(', ')}` });

export const sowingMethods = ['direct', 'transplant', 'either'] as const;
export const sunNeeds = ['full_sun', 'part_shade', 'shade'] as const;
export const frostTolerances = ['tender', 'half_hardy', 'hardy'] as const;
export const feedings = ['heavy', 'moderate', 'light', 'nitrogen_fixing'] as const;
const oneOf = <T extends readonly [string, ...string[]]>(values: T) => z.enum(values, { message: `One of ${values.join(', ')}` });

/** The two marks a value can carry instead of a publication (shared/crops/sources.ts). */
export const SOURCE_MARKS = ['common-practice', 'from-memory'] as const;

/**
 * Where a club's value comes from: a publication in words (or a catalogue source id), or one of the
 * marks `common-practice` / `from-memory`. 60 characters fit the relations' source column; the table
 * or row goes in the note.
 */
export const SourceTextSchema = textSchema({
  min: 1,
  minMessage: 'Name the source, or write common-practice or from-memory',
  max: 60,
});

/** A value with its source and an optional note (the table or row it was read from). */
export function sourcedSchema<T extends z.ZodType>(value: T) {
  return z.strictObject({ value, source: SourceTextSchema, note: textSchema({ max: 200 }).optional() });
}

const num = (min: number, max: number, unit: string) =>
  z.number('Enter a number').min(min, `At least ${min} ${unit}`).max(max, `At most ${max} ${unit}`);

/** A {min, max} pair within bounds, min not above max. */
function rangeSchema(min: number, max: number, unit: string) {
  return z
    .strictObject({ min: num(min, max, unit), max: num(min, max, unit) })
    .refine((r) => r.min <= r.max, { message: 'Must not be below the minimum', path: ['max'] });
}

// Bounds are wide enough for any garden crop and narrow enough to catch a unit mix-up (inches typed
// as metres, °F as °C); the reference catalogue must fit them (shared/schemas/crops.test.ts).
const spacingCm = rangeSchema(0.5, 1000, 'cm');
const daysRange = (max: number) => rangeSchema(1, max, 'days');

/** A botanical family as the rotation rules name it, e.g. Brassicaceae. */
export const FamilySchema = textSchema({ min: 1, max: 60 }).refine(
  (v) => /^[A-Z][a-z]+aceae$/.test(v),
  'A botanical family name ending in -aceae, such as Brassicaceae',
);

const GerminationSchema = z
  .strictObject({
    minC: num(-5, 50, '°C'),
    optimumC: rangeSchema(-5, 50, '°C'),
    maxC: num(-5, 50, '°C'),
  })
  .refine((g) => g.minC <= g.optimumC.min, { message: 'Must not be above the lowest optimum', path: ['minC'] })
  .refine((g) => g.optimumC.max <= g.maxC, { message: 'Must not be below the highest optimum', path: ['maxC'] });

const emergenceDays = z.number('Enter a number of days or null').int('Whole days').min(1, 'At least 1 day').max(365, 'At most 365 days').nullable();

const StorageSchema = z.strictObject({
  temperatureC: rangeSchema(-5, 30, '°C'),
  humidityPct: rangeSchema(0, 100, '%'),
  days: rangeSchema(0, 3650, 'days'),
});

const SideDressingSchema = z
  .strictObject({ needed: z.boolean('true or false'), weeksAfterEmergence: rangeSchema(0, 52, 'weeks').optional() })
  .refine((s) => s.needed || s.weeksAfterEmergence === undefined, {
    message: 'Only when side-dressing is needed',
    path: ['weeksAfterEmergence'],
  });

const coefficient = num(0, 2, '');

/** The schema of each sourced value a Crop holds, by field: what a club crop or an override must satisfy. */
export const cropValueSchemas = {
  botanicalName: textSchema({ min: 1, max: 120 }),
  family: FamilySchema,
  inRowCm: spacingCm,
  betweenRowCm: spacingCm,
  equalSpacingCm: spacingCm,
  sowingDepthCm: rangeSchema(0, 30, 'cm'),
  sowing: oneOf(sowingMethods),
  daysToEmergence: daysRange(365),
  emergenceByTemperature: z.tuple([emergenceDays, emergenceDays, emergenceDays, emergenceDays, emergenceDays], {
    message: 'Five values (days at 10, 15, 20, 25 and 30 °C), each a number of days or null',
  }),
  germination: GerminationSchema,
  daysToMaturity: z
    .strictObject({
      min: num(1, 1500, 'days'),
      max: num(1, 1500, 'days'),
      from: z.enum(['sowing', 'transplanting'], { message: 'One of sowing, transplanting' }),
    })
    .refine((r) => r.min <= r.max, { message: 'Must not be below the minimum', path: ['max'] }),
  soilPh: rangeSchema(3, 10, 'pH'),
  rootingDepthCm: rangeSchema(1, 500, 'cm'),
  minSoilDepthCm: z
    .strictObject({ raisedBed: num(1, 300, 'cm'), container: num(1, 300, 'cm') })
    .refine((d) => d.raisedBed >= d.container, { message: 'Must not be below the container depth', path: ['raisedBed'] }),
  matureHeightCm: rangeSchema(1, 1000, 'cm'),
  sun: oneOf(sunNeeds),
  frost: oneOf(frostTolerances),
  feeding: oneOf(feedings),
  sideDressing: SideDressingSchema,
  kc: z.strictObject({ initial: coefficient, mid: coefficient, end: rangeSchema(0, 2, '') }),
  stages: z.strictObject({
    initial: num(0, 365, 'days'),
    development: num(0, 365, 'days'),
    mid: num(0, 365, 'days'),
    late: num(0, 365, 'days'),
  }),
  storage: StorageSchema,
} satisfies { [K in keyof Crop]?: z.ZodType };

export type CropValueField = keyof typeof cropValueSchemas;

/**
 * Fields a club may override on a reference crop. Names and family stay the catalogue's: they say
 * which plant it is and drive the rotation; a different plant is a club crop of its own.
 */
export const overridableCropFields = [
  'inRowCm',
  'betweenRowCm',
  'equalSpacingCm',
  'sowingDepthCm',
  'sowing',
  'daysToEmergence',
  'emergenceByTemperature',
  'germination',
  'daysToMaturity',
  'soilPh',
  'rootingDepthCm',
  'minSoilDepthCm',
  'matureHeightCm',
  'sun',
  'frost',
  'feeding',
  'sideDressing',
  'kc',
  'stages',
  'storage',
] as const satisfies readonly CropValueField[];
export type OverridableCropField = (typeof overridableCropFields)[number];
export const OverridableCropFieldSchema = z.enum(overridableCropFields, {
  message: 'Not a field a club can override (names and family cannot be)',
});

/** The body of `PUT …/crops/:cropId/overrides/:field`: the value is checked by that field's own schema. */
export function cropOverrideBodySchema(field: OverridableCropField) {
  return sourcedSchema(cropValueSchemas[field]);
}
export interface CropOverrideBody {
  value: unknown;
  source: string;
  note?: string;
}

/** The path of `GET …/crops/:cropId`. */
export const CropParamsSchema = z.object({ cropId: IdTextSchema });
/** The path of `PUT/DELETE …/crops/:cropId/overrides/:field`. */
export const CropOverrideParamsSchema = CropParamsSchema.extend({ field: OverridableCropFieldSchema });
/** The path of `DELETE …/crops/relations/:relationId`. */
export const CropRelationParamsSchema = z.object({ relationId: IdTextSchema });

const pestSlugs = pestsAndDiseases.map((p) => p.slug) as [string, ...string[]];
const GuidanceSchema = z.strictObject({
  sowing: textSchema({ max: 2000, multiline: true }),
  thinning: textSchema({ max: 2000, multiline: true }),
  watering: textSchema({ max: 2000, multiline: true }),
  feeding: textSchema({ max: 2000, multiline: true }),
  pests: textSchema({ max: 2000, multiline: true }),
});

const opt = <K extends CropValueField>(k: K) => sourcedSchema(cropValueSchemas[k]).optional();

/**
 * A club's own crop: names, family and kind, how it is sown and how long it takes, each value with
 * its source; every other value of a Crop may be given the same way. The slug is made from the name.
 */
export const CropCreateBodySchema = z.strictObject({
  commonName: textSchema({ min: 1, minMessage: 'Enter a name', max: 80 }),
  botanicalName: sourcedSchema(cropValueSchemas.botanicalName),
  family: sourcedSchema(cropValueSchemas.family),
  kind: CropKindSchema,
  sowing: sourcedSchema(cropValueSchemas.sowing),
  daysToMaturity: sourcedSchema(cropValueSchemas.daysToMaturity),
  inRowCm: opt('inRowCm'),
  betweenRowCm: opt('betweenRowCm'),
  equalSpacingCm: opt('equalSpacingCm'),
  sowingDepthCm: opt('sowingDepthCm'),
  daysToEmergence: opt('daysToEmergence'),
  emergenceByTemperature: opt('emergenceByTemperature'),
  germination: opt('germination'),
  soilPh: opt('soilPh'),
  rootingDepthCm: opt('rootingDepthCm'),
  minSoilDepthCm: opt('minSoilDepthCm'),
  matureHeightCm: opt('matureHeightCm'),
  sun: opt('sun'),
  frost: opt('frost'),
  feeding: opt('feeding'),
  sideDressing: opt('sideDressing'),
  kc: opt('kc'),
  stages: opt('stages'),
  storage: opt('storage'),
  watchFor: z
    .array(z.enum(pestSlugs, { message: 'Not a pest or disease the plot book knows' }))
    .max(30, 'At most 30')
    .refine((a) => new Set(a).size === a.length, 'Each pest or disease once')
    .optional(),
  guidance: GuidanceSchema.partial().optional(),
});
export type CropCreateBody = z.infer<typeof CropCreateBodySchema>;

const EffectSchema = z.enum(['beneficial', 'antagonistic'], { message: 'One of beneficial, antagonistic' });
const RelationEvidenceSchema = z.enum(['research', 'common_practice'], { message: 'One of research, common_practice' });
const SeveritySchema = z.enum(['clash', 'watch'], { message: 'One of clash, watch' });

/** Same plot only, or across neighbouring plots up to a distance. */
export const RelationScopeSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('same_plot') }),
    z.strictObject({
      kind: z.literal('neighbours'),
      // Kept to the centimetre, as the column holds it.
      distanceM: num(0.1, 50, 'm').transform((m) => Math.round(m * 100) / 100),
    }),
  ],
  { message: 'Either { kind: same_plot } or { kind: neighbours, distanceM }' },
);

/**
 * A club's own relation between two crops it can see. A clash needs research behind it, and research
 * needs a publication: folk antagonisms are only ever a watch, as in the reference relations.
 */
export const CropRelationCreateBodySchema = z
  .strictObject({
    cropAId: IdSchema,
    cropBId: IdSchema,
    effect: EffectSchema,
    scope: RelationScopeSchema,
    reason: textSchema({ min: 1, minMessage: 'Say why, in a sentence', max: 500, multiline: true }),
    evidence: RelationEvidenceSchema,
    severity: SeveritySchema.optional(),
    source: SourceTextSchema,
  })
  .superRefine((r, ctx) => {
    if (r.cropAId === r.cropBId) ctx.addIssue({ code: 'custom', message: 'Choose two different crops', path: ['cropBId'] });
    if (r.severity !== undefined && r.effect !== 'antagonistic') {
      ctx.addIssue({ code: 'custom', message: 'Only an antagonistic relation has a severity', path: ['severity'] });
    }
    if (r.severity === 'clash' && r.evidence !== 'research') {
      ctx.addIssue({ code: 'custom', message: 'A clash needs research behind it; use watch for common practice', path: ['severity'] });
    }
    if (r.evidence === 'research' && (SOURCE_MARKS as readonly string[]).includes(r.source)) {
      ctx.addIssue({ code: 'custom', message: 'Research needs the publication named', path: ['source'] });
    }
  });
export type CropRelationCreateBody = z.infer<typeof CropRelationCreateBodySchema>;

export const cropSorts = ['name', 'family', 'kind', 'daysToMaturity'] as const;

/** The query of `GET /api/clubs/:clubId/crops`. */
export const CropListQuerySchema = z.object({
  q: textSchema({ max: 80 }).optional(),
  family: textSchema({ min: 1, max: 60 })
    .refine((v) => /^[a-z]+aceae$/i.test(v), 'A botanical family name ending in -aceae, such as Brassicaceae')
    .optional(),
  kind: CropKindSchema.optional(),
  sort: z.enum(cropSorts, { message: `One of ${cropSorts.join(', ')}` }).default('name'),
  page: z.coerce.number().int().min(1).max(MAX_INT4).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(50),
});
export type CropListQuery = z.infer<typeof CropListQuerySchema>;

// ---------------------------------------------------------------------------------------------
// Answers.

/** A source resolved for display; `club_cited` is a publication a club named in its own words. */
export const CropSourceViewSchema = z.object({
  id: z.string(),
  title: z.string(),
  evidence: z.enum(['published', 'computed', 'common_practice', 'from_memory', 'club_cited']),
  url: z.string().optional(),
});
export type CropSourceView = z.infer<typeof CropSourceViewSchema>;

/** A value as the detail shows it: `overridden` marks the club's own value, with the club's source. */
export function sourcedViewSchema<T extends z.ZodType>(value: T) {
  return z.object({ value, source: z.string(), note: z.string().optional(), overridden: z.literal(true).optional() });
}

export const CropSummarySchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  commonName: z.string(),
  botanicalName: z.string(),
  family: z.string(),
  kind: CropKindSchema,
  sowing: z.enum(sowingMethods),
  daysToMaturity: z.object({ min: z.number(), max: z.number(), from: z.enum(['sowing', 'transplanting']) }),
  isClubCrop: z.boolean(),
  hasOverrides: z.boolean(),
});
export type CropSummary = z.infer<typeof CropSummarySchema>;

export const CropRelationViewSchema = z.object({
  id: z.number().int(),
  otherCrop: z.object({ id: z.number().int(), slug: z.string(), commonName: z.string() }),
  effect: EffectSchema,
  scope: z.union([z.object({ kind: z.literal('same_plot') }), z.object({ kind: z.literal('neighbours'), distanceM: z.number() })]),
  reason: z.string(),
  evidence: RelationEvidenceSchema,
  severity: SeveritySchema.nullable(),
  source: CropSourceViewSchema,
  /** The club's own relation (a coordinator may remove it); a reference one cannot be removed. */
  isClubRelation: z.boolean(),
});
export type CropRelationView = z.infer<typeof CropRelationViewSchema>;

const view = <K extends CropValueField>(k: K) => sourcedViewSchema(cropValueSchemas[k]);

/**
 * One crop with the club's overrides applied. A club crop may lack the optional values; a relation the
 * club has set for a pair replaces the reference one for that pair.
 */
export const CropDetailSchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  commonName: z.string(),
  kind: CropKindSchema,
  isClubCrop: z.boolean(),
  botanicalName: view('botanicalName'),
  family: view('family'),
  inRowCm: view('inRowCm').optional(),
  betweenRowCm: view('betweenRowCm').optional(),
  equalSpacingCm: view('equalSpacingCm').optional(),
  sowingDepthCm: view('sowingDepthCm').optional(),
  sowing: view('sowing'),
  daysToEmergence: view('daysToEmergence').optional(),
  emergenceByTemperature: view('emergenceByTemperature').optional(),
  germination: view('germination').optional(),
  daysToMaturity: view('daysToMaturity'),
  soilPh: view('soilPh').optional(),
  rootingDepthCm: view('rootingDepthCm').optional(),
  minSoilDepthCm: view('minSoilDepthCm').optional(),
  matureHeightCm: view('matureHeightCm').optional(),
  sun: view('sun').optional(),
  frost: view('frost').optional(),
  feeding: view('feeding').optional(),
  sideDressing: view('sideDressing').optional(),
  kc: view('kc').optional(),
  stages: view('stages').optional(),
  storage: view('storage').optional(),
  watchFor: z.array(z.string()),
  guidance: z.object({
    sowing: z.string().optional(),
    thinning: z.string().optional(),
    watering: z.string().optional(),
    feeding: z.string().optional(),
    pests: z.string().optional(),
  }),
  relations: z.array(CropRelationViewSchema),
  /** Every source a value or relation above points at, resolved to its title. */
  sources: z.array(CropSourceViewSchema),
});
export type CropDetail = z.infer<typeof CropDetailSchema>;

const CropRefSchema = z.object({ id: z.number().int(), slug: z.string(), commonName: z.string() });

/** A club relation as `POST …/crops/relations` answers it. */
export const ClubCropRelationSchema = z.object({
  id: z.number().int(),
  cropA: CropRefSchema,
  cropB: CropRefSchema,
  effect: EffectSchema,
  scope: CropRelationViewSchema.shape.scope,
  reason: z.string(),
  evidence: RelationEvidenceSchema,
  severity: SeveritySchema.nullable(),
  source: CropSourceViewSchema,
});
export type ClubCropRelation = z.infer<typeof ClubCropRelationSchema>;
