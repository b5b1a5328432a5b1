import { z } from 'zod';
import { crossFieldProblems, isEmptyDay, weatherQuantity, weatherValueKeys, type WeatherValueKey } from '../weather/quantities';
import { weatherUnitLabel } from '../weather/units';
import { csvFileSchema } from './common';
import { UnitsSchema } from './sites';

/** The first day a weather log may hold. */
export const EARLIEST_WEATHER_DAY = '2000-01-01';
/** The most days one read of the log answers. */
export const MAX_WEATHER_DAYS_PER_REQUEST = 400;
/** Days the log shows when no range is asked for: the last eight weeks, today included. */
export const DEFAULT_WEATHER_DAYS = 56;

/** A calendar day of the log, in the site's zone: a real date from 2000-01-01 (the site's today is checked by the service). */
export const WeatherDayTextSchema = z.iso
  .date('Use a date like 2026-06-03')
  .refine((d) => d >= EARLIEST_WEATHER_DAY, `On or after ${EARLIEST_WEATHER_DAY}`);

function valueSchema(key: WeatherValueKey) {
  const q = weatherQuantity[key];
  const unit = weatherUnitLabel(q.kind, 'metric');
  return z
    .number(`A number in ${unit}`)
    .finite(`A number in ${unit}`)
    .min(q.min, `At least ${q.min} ${unit}`)
    .max(q.max, `At most ${q.max} ${unit}`)
    .nullable();
}

const valueShape = Object.fromEntries(weatherValueKeys.map((k) => [k, valueSchema(k)])) as {
  [K in WeatherValueKey]: ReturnType<typeof valueSchema>;
};

/** Where a day's values came from: a quick rain-gauge entry, the day's form, or a CSV import. */
export const weatherSources = ['gauge', 'form', 'import'] as const;
export const WeatherSourceSchema = z.enum(weatherSources);
export type WeatherSource = z.infer<typeof WeatherSourceSchema>;

/**
 * PUT /api/sites/:siteId/weather/:day: any of the values, in SI (°C, mm, % RH, m/s, m, h, MJ/m²).
 * A value left out keeps what the day holds; null clears it. `source` says which form sent it.
 */
const optionalValueShape = Object.fromEntries(weatherValueKeys.map((k) => [k, valueShape[k].optional()])) as {
  [K in WeatherValueKey]: z.ZodOptional<ReturnType<typeof valueSchema>>;
};

export const WeatherDayBodySchema = z
  .strictObject({
    ...optionalValueShape,
    source: z.enum(['gauge', 'form'], { message: 'Use gauge or form' }).default('form'),
  })
  .superRefine((body, ctx) => {
    if (weatherValueKeys.every((k) => body[k] === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['rainMm'], message: 'Give at least one value for the day, such as the rain' });
      return;
    }
    for (const [key, message] of Object.entries(crossFieldProblems(body))) ctx.addIssue({ code: 'custom', path: [key], message });
  }, {
    // Only a body that is otherwise right is checked as a whole, so an unknown or bad field is named alone.
    when: ({ issues }) => issues.length === 0,
  });
export type WeatherDayBody = z.infer<typeof WeatherDayBodySchema>;

/** One day of the log as the API answers it, in SI. `enteredByName` is there only for coordinators. */
export const WeatherDaySchema = z.object({
  day: z.string(),
  ...valueShape,
  source: WeatherSourceSchema,
  updatedAt: z.string(),
  enteredByName: z.string().nullable().optional(),
});
export type WeatherDay = z.infer<typeof WeatherDaySchema>;

/** GET /api/sites/:siteId/weather: the days asked for, newest first, with how to show them and what the reader may do. */
export const WeatherLogSchema = z.object({
  siteId: z.number().int(),
  siteName: z.string(),
  units: UnitsSchema,
  timeZone: z.string(),
  /** Today in the site's zone: the latest day the log takes. */
  today: z.string(),
  from: z.string(),
  to: z.string(),
  canWrite: z.boolean(),
  /** Coordinators delete days and see who entered them. */
  canDelete: z.boolean(),
  days: z.array(WeatherDaySchema),
});
export type WeatherLog = z.infer<typeof WeatherLogSchema>;

/** ?from=&to= on the log and its CSV: calendar days, both ends included. */
export const WeatherRangeQuerySchema = z.object({
  from: WeatherDayTextSchema.optional(),
  to: WeatherDayTextSchema.optional(),
});

/** ?units= and the range, on the CSV download. */
export const WeatherCsvQuerySchema = WeatherRangeQuerySchema.extend({ units: UnitsSchema.optional() });

/** The sites of a club a person may log weather for, with what the rain gauge needs. */
export const WeatherSiteSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  units: UnitsSchema,
  timeZone: z.string(),
  today: z.string(),
  canWrite: z.boolean(),
});
export type WeatherSite = z.infer<typeof WeatherSiteSchema>;
export const WeatherSitesSchema = z.object({ items: z.array(WeatherSiteSchema) });
export type WeatherSites = z.infer<typeof WeatherSitesSchema>;

/** Columns of a weather CSV, in this order in exports and the template; only `date` is required. */
export const weatherCsvColumns = [
  'date',
  't_min',
  't_max',
  'rain',
  'rh_min',
  'rh_max',
  'rh_mean',
  'wind',
  'wind_height',
  'sunshine_hours',
  'solar_radiation',
] as const;
export type WeatherCsvColumn = (typeof weatherCsvColumns)[number];

/** What to do with a day in the file that the log already holds. */
export const weatherDuplicateChoices = ['skip', 'replace'] as const;

export const WeatherImportBodySchema = z.strictObject({
  csv: csvFileSchema(2_000_000, 'The file is larger than 2 MB'),
  /** Units of the file: metric °C, mm, m/s, m; US °F, inches, mph, feet. Solar radiation is MJ/m² in both. */
  units: UnitsSchema,
  /** skip: keep the stored day; replace: the file's row becomes the day. */
  duplicates: z.enum(weatherDuplicateChoices, { message: 'Use skip or replace' }),
  /** false: check and preview only; true: check and save every row or none. */
  commit: z.boolean(),
});
export type WeatherImportBody = z.infer<typeof WeatherImportBodySchema>;

const WeatherValuesSchema = z.object(Object.fromEntries(weatherValueKeys.map((k) => [k, z.number().nullable()])) as { [K in WeatherValueKey]: z.ZodNullable<z.ZodNumber> });

export const WeatherImportResultSchema = z.object({
  rows: z.array(
    z.object({
      row: z.number().int(),
      day: z.string(),
      /** The row's values in SI; null when the row has a problem. */
      values: WeatherValuesSchema.nullable(),
      /** new: not in the log yet; replace: the file's row replaces the stored day; skip: the stored day stays. */
      status: z.enum(['new', 'replace', 'skip']).nullable(),
    }),
  ),
  errors: z.array(z.object({ row: z.number().int(), field: z.string(), message: z.string() })),
  counts: z.object({ new: z.number().int(), replaced: z.number().int(), skipped: z.number().int() }),
  committed: z.boolean(),
  /** The days the import wrote (new and replaced), oldest first; empty for a preview. */
  changedDays: z.array(z.string()),
});
export type WeatherImportResult = z.infer<typeof WeatherImportResultSchema>;

/** True when a day's values are all empty (such a day is not kept). */
export const isEmptyWeatherDay = isEmptyDay;
