import { z } from 'zod';
import { textSchema, VersionSchema } from './common';

export const unitsValues = ['metric', 'us'] as const;
export const UnitsSchema = z.enum(unitsValues);
/** ?units=metric|us on CSV downloads and templates; the site's own units when left out. */
export const UnitsQuerySchema = z.object({ units: UnitsSchema.optional() });

/** A typical frost date as month-day, e.g. "04-25". */
export const MonthDaySchema = z
  .string()
  .regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'Use month-day, e.g. 04-25');

const timeZoneSchema = z.string().refine((tz) => {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}, 'Unknown time zone (use a name like Europe/London)');

/** The smallest side a site may have, in metres; smaller is a typing slip (common practice). */
export const MIN_SITE_SIDE_M = 1;
/** The largest side a site may have, in metres: a club's ground, not a county. */
export const MAX_SITE_SIDE_M = 2000;
const siteSide = () =>
  z
    .number()
    .positive('Must be more than 0')
    .min(MIN_SITE_SIDE_M, `At least ${MIN_SITE_SIDE_M} m`)
    .max(MAX_SITE_SIDE_M, 'At most 2 km');

/** Map-background scale bounds, metres per pixel: the column keeps 6 decimals, so smaller would be stored as 0. */
export const MIN_METRES_PER_PIXEL = 0.00001;
export const MAX_METRES_PER_PIXEL = 100;

/** The lowest and highest elevation a site may have, metres above sea level: the Dead Sea shore is about −430 m and no garden is near 9000 m (from memory). */
export const MIN_ELEVATION_M = -500;
export const MAX_ELEVATION_M = 9000;

const siteFields = {
  name: textSchema({ min: 1, minMessage: 'Enter a name', max: 120 }),
  address: textSchema({ max: 500, multiline: true }),
  latitude: z.number().min(-90, 'Between -90 and 90').max(90, 'Between -90 and 90'),
  longitude: z.number().min(-180, 'Between -180 and 180').max(180, 'Between -180 and 180'),
  timeZone: timeZoneSchema,
  units: UnitsSchema,
  pathWidth: z.number().min(0, 'Cannot be negative').max(10, 'At most 10 m'),
  grid: z.number().min(0, 'Cannot be negative').max(10, 'At most 10 m'),
  width: siteSide(),
  length: siteSide(),
  lastSpringFrost: MonthDaySchema.nullable(),
  firstAutumnFrost: MonthDaySchema.nullable(),
  soilNotes: textSchema({ max: 4000, multiline: true }),
  /** Typical soil temperature at sowing depth for each month, °C, January first; null until the club knows them. */
  soilTempsC: z
    .array(z.number('A temperature in °C').finite().min(-30, 'At least −30 °C').max(50, 'At most 50 °C'), 'Twelve monthly temperatures')
    .length(12, 'Give all twelve months, or none')
    .nullable(),
  /** Whole metres above sea level (the client converts feet); null until the club knows it. */
  elevationM: z
    .number('Whole metres above sea level')
    .int('Whole metres above sea level')
    .min(MIN_ELEVATION_M, `At least ${MIN_ELEVATION_M} m`)
    .max(MAX_ELEVATION_M, `At most ${MAX_ELEVATION_M} m`)
    .nullable(),
};

/** Fields a coordinator sets on a new site; lengths are metres (the client converts US units). */
export const SiteCreateBodySchema = z.strictObject({
  ...siteFields,
  address: siteFields.address.default(''),
  units: siteFields.units.default('metric'),
  pathWidth: siteFields.pathWidth.default(0.9),
  grid: siteFields.grid.default(0.5),
  lastSpringFrost: siteFields.lastSpringFrost.default(null),
  firstAutumnFrost: siteFields.firstAutumnFrost.default(null),
  soilNotes: siteFields.soilNotes.default(''),
  soilTempsC: siteFields.soilTempsC.default(null),
  elevationM: siteFields.elevationM.default(null),
});
export type SiteCreateBody = z.infer<typeof SiteCreateBodySchema>;

/** A change to a site, with the version the editor last saw. */
export const SiteUpdateBodySchema = z
  .strictObject(siteFields)
  .partial()
  .extend({
    version: VersionSchema,
    backgroundMetresPerPixel: z
      .number()
      .min(MIN_METRES_PER_PIXEL, `At least ${MIN_METRES_PER_PIXEL} m per pixel`)
      .max(MAX_METRES_PER_PIXEL, `At most ${MAX_METRES_PER_PIXEL} m per pixel`)
      .nullable()
      .optional(),
  });
export type SiteUpdateBody = z.infer<typeof SiteUpdateBodySchema>;

/** Archiving a site, with the version the coordinator last saw. */
export const SiteArchiveBodySchema = z.strictObject({ version: z.number().int().positive() });
export type SiteArchiveBody = z.infer<typeof SiteArchiveBodySchema>;

export const SiteSchema = z.object({
  id: z.number().int(),
  clubId: z.number().int(),
  name: z.string(),
  address: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  timeZone: z.string(),
  units: UnitsSchema,
  pathWidth: z.number(),
  grid: z.number(),
  width: z.number(),
  length: z.number(),
  lastSpringFrost: z.string().nullable(),
  firstAutumnFrost: z.string().nullable(),
  soilNotes: z.string(),
  soilTempsC: z.array(z.number()).nullable(),
  elevationM: z.number().int().nullable(),
  background: z
    .object({
      url: z.string(),
      widthPx: z.number().int(),
      heightPx: z.number().int(),
      metresPerPixel: z.number().nullable(),
    })
    .nullable(),
  plotCount: z.number().int(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Site = z.infer<typeof SiteSchema>;
