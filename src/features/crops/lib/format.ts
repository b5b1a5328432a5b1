import type { Crop, CropKind } from '@shared/crops/types';
import type { CropDetail, CropValueField } from '@shared/schemas/crops';

// Values arrive in SI (cm, °C, days). A source that printed inches or °F says so in its note, and
// then the page gives that unit too, so a reader can hold the figure against the printed table.

const CM_PER_INCH = 2.54;

/** A number with at most `digits` decimals and no trailing zeros. */
export function trimNumber(n: number, digits = 1): string {
  return Number(n.toFixed(digits)).toLocaleString('en-GB', { maximumFractionDigits: digits });
}

const span = (min: string, max: string) => (min === max ? min : `${min}–${max}`);

/** True when the source printed this value in inches. */
export const printedInInches = (note?: string) => note !== undefined && /[\d¼½¾]\s*in\b/.test(note);
/** True when the source printed this value in degrees Fahrenheit. */
export const printedInFahrenheit = (note?: string) => note !== undefined && /°F/.test(note);

/** A length range in cm, with inches in brackets when the source printed inches, e.g. "5 cm (2 in)". */
export function formatCmRange(r: { min: number; max: number }, note?: string): string {
  const digits = r.max < 10 ? 1 : 0;
  const cm = `${span(trimNumber(r.min, digits), trimNumber(r.max, digits))} cm`;
  if (!printedInInches(note)) return cm;
  return `${cm} (${span(trimNumber(r.min / CM_PER_INCH, 2), trimNumber(r.max / CM_PER_INCH, 2))} in)`;
}

/** One length in cm, with inches in brackets when the source printed inches, e.g. "10 cm (3.94 in)". */
export function formatCm(cm: number, note?: string): string {
  return formatCmRange({ min: cm, max: cm }, note);
}

const toFahrenheit = (c: number) => (c * 9) / 5 + 32;

/** One temperature in °C, with °F in brackets when the source printed °F. */
export function formatTemperature(c: number, note?: string): string {
  const text = `${trimNumber(c)} °C`;
  return printedInFahrenheit(note) ? `${text} (${trimNumber(toFahrenheit(c), 0)} °F)` : text;
}

/** A temperature range in °C, with °F in brackets when the source printed °F. */
export function formatTemperatureRange(r: { min: number; max: number }, note?: string): string {
  const text = `${span(trimNumber(r.min), trimNumber(r.max))} °C`;
  if (!printedInFahrenheit(note)) return text;
  return `${text} (${span(trimNumber(toFahrenheit(r.min), 0), trimNumber(toFahrenheit(r.max), 0))} °F)`;
}

/** A range of days, e.g. "25–50 days". */
export function formatDays(r: { min: number; max: number }): string {
  return `${span(trimNumber(r.min, 0), trimNumber(r.max, 0))} ${r.min === 1 && r.max === 1 ? 'day' : 'days'}`;
}

/** Days to maturity with what they count from, e.g. "25–50 days from sowing". */
export function formatMaturity(d: { min: number; max: number; from: 'sowing' | 'transplanting' }): string {
  return `${formatDays(d)} from ${d.from}`;
}

export const kindLabels: Record<CropKind, string> = {
  root: 'Root',
  leaf: 'Leaf',
  fruiting: 'Fruiting',
  legume: 'Legume',
  allium: 'Onion family',
  brassica: 'Cabbage family',
  herb: 'Herb',
  flower: 'Flower',
};

export const sowingLabels = {
  direct: 'Sown direct',
  transplant: 'Transplanted',
  either: 'Sown direct or transplanted',
} as const;

export const sunLabels = { full_sun: 'Full sun', part_shade: 'Part shade', shade: 'Shade' } as const;

export const frostLabels = { tender: 'Tender', half_hardy: 'Half hardy', hardy: 'Hardy' } as const;

export const feedingLabels = {
  heavy: 'Heavy feeder',
  moderate: 'Moderate feeder',
  light: 'Light feeder',
  nitrogen_fixing: 'Fixes its own nitrogen',
} as const;

/** The evidence word beside every value: text, so it reads without colour. */
export const evidenceLabels = {
  published: 'published',
  computed: 'computed',
  common_practice: 'common practice',
  from_memory: 'from memory',
  club_cited: 'named by the club',
} as const;

type ValueOf<K extends keyof Crop> = NonNullable<Crop[K]> extends { value: infer V } ? V : never;
type ViewOf<K extends keyof Crop> = { value: ValueOf<K>; source: string; note?: string; overridden?: true };
type RequiredField = 'botanicalName' | 'family' | 'sowing' | 'daysToMaturity';

/**
 * CropDetail with each value typed as the catalogue types it. The zod schema checks every value with
 * its field's own schema, but its inferred type loses the field (the schema is built by a generic
 * helper), so the page reads the parsed answer through this type.
 */
export type TypedCropDetail = Omit<CropDetail, CropValueField> & { [K in RequiredField]: ViewOf<K> } & {
  [K in Exclude<CropValueField, RequiredField>]?: ViewOf<K>;
};
