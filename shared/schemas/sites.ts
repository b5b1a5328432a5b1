import { z } from 'zod';

export const unitsValues = ['metric', 'us'] as const;
export const UnitsSchema = z.enum(unitsValues);

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

const siteFields = {
  name: z.string().trim().min(1, 'Enter a name').max(120),
  address: z.string().trim().max(500),
  latitude: z.number().min(-90, 'Between -90 and 90').max(90, 'Between -90 and 90'),
  longitude: z.number().min(-180, 'Between -180 and 180').max(180, 'Between -180 and 180'),
  timeZone: timeZoneSchema,
  units: UnitsSchema,
  pathWidth: z.number().min(0, 'Cannot be negative').max(10, 'At most 10 m'),
  grid: z.number().min(0, 'Cannot be negative').max(10, 'At most 10 m'),
  width: z.number().positive('Must be more than 0').max(2000, 'At most 2 km'),
  length: z.number().positive('Must be more than 0').max(2000, 'At most 2 km'),
  lastSpringFrost: MonthDaySchema.nullable(),
  firstAutumnFrost: MonthDaySchema.nullable(),
  soilNotes: z.string().trim().max(4000),
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
});
export type SiteCreateBody = z.infer<typeof SiteCreateBodySchema>;

/** A change to a site, with the version the editor last saw. */
export const SiteUpdateBodySchema = z
  .strictObject(siteFields)
  .partial()
  .extend({
    version: z.number().int().positive(),
    backgroundMetresPerPixel: z.number().positive().max(100).nullable().optional(),
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
