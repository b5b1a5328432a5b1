import { z } from 'zod';
import { fromDisplayLength, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import { MAX_ELEVATION_M, MIN_ELEVATION_M, SiteCreateBodySchema, UnitsSchema, type Site, type SiteCreateBody, type SiteUpdateBody } from '@shared/schemas/sites';
import {
  fromDisplayTemperature,
  MONTHS,
  sameSoilTemps,
  soilTempBounds,
  soilTempsText,
  temperatureUnitLabel,
  toDisplayTemperature,
} from './soil-temps';

/** The lengths the form shows in the site's units; the API always takes metres. */
export const lengthFields = ['width', 'length', 'pathWidth', 'grid'] as const;
export type LengthField = (typeof lengthFields)[number];

/**
 * What the inputs hold: text as typed, lengths in the chosen units, frost dates as "MM-DD" or "",
 * soil temperatures as twelve texts (January first) in °C or °F by the chosen units.
 */
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
  soilTemps: string[];
  /** Whole metres or feet above sea level by the chosen units; empty when not known. */
  elevation: string;
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
  'soilTemps',
  'elevation',
] as const satisfies readonly (keyof SiteFormValues)[];

/** One input per month: `soilTemps.0` is January. */
export const soilTempFieldNames = Array.from({ length: MONTHS }, (_, i) => `soilTemps.${i}` as const);

/** The message when some months are filled and others are not. */
export const SOIL_TEMPS_INCOMPLETE = 'Fill in all twelve months, or leave them all empty';

/**
 * The form's name for a field the server named: the server checks `soilTempsC` (°C) and its months
 * `soilTempsC.3`; the form holds them as `soilTemps` in the site's units. Other names are the same.
 */
export function formFieldOf(serverField: string): string {
  if (serverField === 'elevationM') return 'elevation';
  const month = /^soilTempsC\.(\d+)$/.exec(serverField);
  if (month && Number(month[1]) < MONTHS) return `soilTemps.${Number(month[1])}`;
  if (serverField === 'soilTempsC' || serverField.startsWith('soilTempsC.')) return 'soilTemps';
  return serverField;
}

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

/** Twelve typed temperatures; the refinement below checks each is a number or empty, and all or none filled. */
const soilTempsTexts = z.array(z.string()).length(MONTHS);

/**
 * Reads the form into an API body: numbers from text, lengths to metres, blank frost dates to null,
 * soil temperatures to °C (all blank to null), then checks the result against the shared site schema so the form and the server apply one set of rules.
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
    soilTemps: soilTempsTexts,
    elevation: z
      .string()
      .trim()
      .refine((v) => v === '' || /^[+-]?\d+(\.\d*)?$/.test(v), 'Enter a whole number, like 60 (or leave it empty)'),
  })
  .superRefine((v, ctx) => {
    const unit = temperatureUnitLabel(v.units);
    const { min, max } = soilTempBounds(v.units);
    const texts = v.soilTemps.map((t) => t.trim());
    texts.forEach((text, i) => {
      if (text === '') return;
      if (!NUMBER.test(text)) {
        ctx.addIssue({ code: 'custom', path: ['soilTemps', i], message: 'Enter a number, like 12.5' });
        return;
      }
      // Checked in the units the person typed, so the message names them; the bounds are the server's.
      const value = Number(text);
      if (value < min) ctx.addIssue({ code: 'custom', path: ['soilTemps', i], message: `At least ${min} ${unit}` });
      else if (value > max) ctx.addIssue({ code: 'custom', path: ['soilTemps', i], message: `At most ${max} ${unit}` });
    });
    const elevation = elevationMetres(v.elevation, v.units);
    if (elevation !== null && !Number.isNaN(elevation) && (elevation < MIN_ELEVATION_M || elevation > MAX_ELEVATION_M)) {
      // Said in the units typed: −500 to 9000 m is −1640 to 29528 ft.
      const lo = Math.round(toDisplayLength(MIN_ELEVATION_M, v.units));
      const hi = Math.round(toDisplayLength(MAX_ELEVATION_M, v.units));
      const u = v.units === 'us' ? 'ft' : 'm';
      ctx.addIssue({ code: 'custom', path: ['elevation'], message: elevation < MIN_ELEVATION_M ? `At least ${lo} ${u}` : `At most ${hi} ${u}` });
    }
    const filled = texts.filter((t) => t !== '').length;
    if (filled > 0 && filled < MONTHS) ctx.addIssue({ code: 'custom', path: ['soilTemps'], message: SOIL_TEMPS_INCOMPLETE });
  }, {
    // Runs even when another field (say latitude) is wrong, so every mistake shows at once; it needs only
    // the units and the twelve texts to be readable.
    when: ({ value }) => {
      const v = value as { units?: unknown; soilTemps?: unknown } | null;
      return UnitsSchema.safeParse(v?.units).success && soilTempsTexts.safeParse(v?.soilTemps).success && typeof (v as { elevation?: unknown } | null)?.elevation === 'string';
    },
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
      soilTempsC: v.soilTemps.every((t) => t.trim() === '')
        ? null
        : v.soilTemps.map((t) => fromDisplayTemperature(Number(t.trim()), v.units)),
      elevationM: elevationMetres(v.elevation, v.units),
    }),
  )
  .pipe(SiteCreateBodySchema);

/** A typed elevation (metres, or feet on a US site) as whole metres, as the site keeps it; null when empty. */
export function elevationMetres(text: string, units: UnitSystem): number | null {
  const value = text.trim();
  if (value === '') return null;
  return Math.round(fromDisplayLength(Number(value), units));
}

/** A stored elevation as the form shows it: whole metres, or whole feet on a US site. */
export function elevationText(metres: number | null, units: UnitSystem): string {
  return metres === null ? '' : String(Math.round(toDisplayLength(metres, units)));
}

/** Re-expresses a typed elevation in other units (60 m → 197 ft); text that is not a number is left alone. */
export function convertElevationText(text: string, from: UnitSystem, to: UnitSystem): string {
  const value = text.trim();
  if (!NUMBER.test(value) || from === to) return text;
  return String(Math.round(toDisplayLength(fromDisplayLength(Number(value), from), to)));
}

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

/** Re-expresses a typed temperature in other units (10 °C → 50 °F); text that is not a number is left alone. */
export function convertTemperatureText(text: string, from: UnitSystem, to: UnitSystem): string {
  const value = text.trim();
  if (!NUMBER.test(value) || from === to) return text;
  return String(toDisplayTemperature(fromDisplayTemperature(Number(value), from), to));
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
    soilTemps: soilTempsText(null, 'metric'),
    elevation: '',
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
    soilTemps: soilTempsText(site.soilTempsC, units),
    elevation: elevationText(site.elevationM, units),
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
  if (!sameSoilTemps(body.soilTempsC, site.soilTempsC)) changes.soilTempsC = body.soilTempsC;
  if ((body.elevationM ?? null) !== site.elevationM) changes.elevationM = body.elevationM ?? null;
  return changes;
}

/** True when two versions of a site would fill the form the same way (e.g. only the background changed). */
export function sameFormFields(a: Site, b: Site): boolean {
  const x = siteToForm(a);
  const y = siteToForm(b);
  return siteFormFieldNames.every((name) => {
    const a = x[name];
    const b = y[name];
    return Array.isArray(a) && Array.isArray(b) ? a.length === b.length && a.every((t, i) => t === b[i]) : a === b;
  });
}
