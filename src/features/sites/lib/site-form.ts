import { z } from 'zod';
import { fromDisplayLength, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import { SiteCreateBodySchema, UnitsSchema, type Site, type SiteCreateBody, type SiteUpdateBody } from '@shared/schemas/sites';

/** The lengths the form shows in the site's units; the API always takes metres. */
export const lengthFields = ['width', 'length', 'pathWidth', 'grid'] as const;
export type LengthField = (typeof lengthFields)[number];

/** What the inputs hold: text as typed, lengths in the chosen units, frost dates as "MM-DD" or "". */
export interface SiteFormValues {
  name: string;
  address: string;
  latitude: string;
  longitude: string;
  timeZone: string;
  units: UnitSystem;
  width: string;
  length: string;
  pathWidth: string;
  grid: string;
  lastSpringFrost: string;
  firstAutumnFrost: string;
  soilNotes: string;
}

export const siteFormFieldNames = [
  'name',
  'address',
  'latitude',
  'longitude',
  'timeZone',
  'units',
  ...lengthFields,
  'lastSpringFrost',
  'firstAutumnFrost',
  'soilNotes',
] as const satisfies readonly (keyof SiteFormValues)[];

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;
const numberText = z
  .string()
  .trim()
  .min(1, 'Enter a number')
  .refine((v) => NUMBER.test(v), 'Enter a number, like 2.5 (with a dot for decimals)');
const monthDayText = z
  .string()
  .refine((v) => v === '' || /^\d\d-\d\d$/.test(v), 'Pick both a month and a day, or neither');
const shape = SiteCreateBodySchema.shape;

/**
 * Reads the form into an API body: numbers from text, lengths to metres, blank frost dates to null,
 * then checks the result against the shared site schema so the form and the server apply one set of rules.
 */
export const SiteFormSchema = z
  .object({
    name: shape.name,
    address: z.string(),
    latitude: numberText.transform(Number).pipe(shape.latitude),
    longitude: numberText.transform(Number).pipe(shape.longitude),
    timeZone: z.string().trim().min(1, 'Enter a time zone, like Europe/London').pipe(shape.timeZone),
    units: UnitsSchema,
    width: numberText,
    length: numberText,
    pathWidth: numberText,
    grid: numberText,
    lastSpringFrost: monthDayText,
    firstAutumnFrost: monthDayText,
    soilNotes: z.string(),
  })
  .transform(
    (v): z.input<typeof SiteCreateBodySchema> => ({
      name: v.name,
      address: v.address.trim(),
      latitude: v.latitude,
      longitude: v.longitude,
      timeZone: v.timeZone,
      units: v.units,
      width: fromDisplayLength(Number(v.width), v.units),
      length: fromDisplayLength(Number(v.length), v.units),
      pathWidth: fromDisplayLength(Number(v.pathWidth), v.units),
      grid: fromDisplayLength(Number(v.grid), v.units),
      lastSpringFrost: v.lastSpringFrost || null,
      firstAutumnFrost: v.firstAutumnFrost || null,
      soilNotes: v.soilNotes.trim(),
    }),
  )
  .pipe(SiteCreateBodySchema);

// Metres to the millimetre, as stored; feet to two places, which is finer than anyone measures a garden.
const displayDecimals: Record<UnitSystem, number> = { metric: 3, us: 2 };

/** A stored length as the form shows it in the given units. */
export function lengthText(metres: number, units: UnitSystem): string {
  return String(roundTo(toDisplayLength(metres, units), displayDecimals[units]));
}

/** Re-expresses a typed length in other units (3 m → 9.84 ft); text that is not a number is left alone. */
export function convertLengthText(text: string, from: UnitSystem, to: UnitSystem): string {
  const value = text.trim();
  if (!NUMBER.test(value) || from === to) return text;
  return lengthText(fromDisplayLength(Number(value), from), to);
}

/** Round numbers a new site starts with in each unit system (a 3 ft path is the US habit, common practice). */
export const newSiteLengths: Record<UnitSystem, Pick<SiteFormValues, 'pathWidth' | 'grid'>> = {
  metric: { pathWidth: '0.9', grid: '0.5' },
  us: { pathWidth: '3', grid: '1' },
};

function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone;
  } catch {
    return '';
  }
}

/** The inputs for a new site: the browser's time zone, metric, the usual path and grid. */
export function emptySiteForm(): SiteFormValues {
  return {
    name: '',
    address: '',
    latitude: '',
    longitude: '',
    timeZone: browserTimeZone(),
    units: 'metric',
    width: '',
    length: '',
    ...newSiteLengths.metric,
    lastSpringFrost: '',
    firstAutumnFrost: '',
    soilNotes: '',
  };
}

/** The inputs filled from a saved site, lengths in its own units. */
export function siteToForm(site: Site): SiteFormValues {
  const units = site.units;
  return {
    name: site.name,
    address: site.address,
    latitude: String(site.latitude),
    longitude: String(site.longitude),
    timeZone: site.timeZone,
    units,
    width: lengthText(site.width, units),
    length: lengthText(site.length, units),
    pathWidth: lengthText(site.pathWidth, units),
    grid: lengthText(site.grid, units),
    lastSpringFrost: site.lastSpringFrost ?? '',
    firstAutumnFrost: site.firstAutumnFrost ?? '',
    soilNotes: site.soilNotes,
  };
}

// Two feet-decimals are about 1.5 mm, so a length within 2 mm of the stored one is the stored one
// re-read through rounding, not an edit; sending it could shrink a site onto its plots' edges.
const SAME_LENGTH_M = 0.002;
const SAME_DEGREES = 1e-6;

/** Only what the person changed, plus the version the form was filled from, for a PATCH. */
export function siteChanges(site: Site, body: SiteCreateBody): SiteUpdateBody {
  const changes: SiteUpdateBody = { version: site.version };
  const near = (a: number, b: number, tolerance: number) => Math.abs(a - b) < tolerance;
  if (body.name !== site.name) changes.name = body.name;
  if (body.address !== site.address) changes.address = body.address;
  if (!near(body.latitude, site.latitude, SAME_DEGREES)) changes.latitude = body.latitude;
  if (!near(body.longitude, site.longitude, SAME_DEGREES)) changes.longitude = body.longitude;
  if (body.timeZone !== site.timeZone) changes.timeZone = body.timeZone;
  if (body.units !== site.units) changes.units = body.units;
  for (const field of lengthFields) {
    if (!near(body[field], site[field], SAME_LENGTH_M)) changes[field] = body[field];
  }
  if (body.lastSpringFrost !== site.lastSpringFrost) changes.lastSpringFrost = body.lastSpringFrost;
  if (body.firstAutumnFrost !== site.firstAutumnFrost) changes.firstAutumnFrost = body.firstAutumnFrost;
  if (body.soilNotes !== site.soilNotes) changes.soilNotes = body.soilNotes;
  return changes;
}

/** True when two versions of a site would fill the form the same way (e.g. only the background changed). */
export function sameFormFields(a: Site, b: Site): boolean {
  const x = siteToForm(a);
  const y = siteToForm(b);
  return siteFormFieldNames.every((name) => x[name] === y[name]);
}
