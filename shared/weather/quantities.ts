import { roundTo, type UnitSystem } from '../geometry/units';
import { weatherFromSi, weatherToSi, weatherUnitLabel, type WeatherKind } from './units';

// The values a weather day can hold, in one table so the schemas, the database mapping, the CSV files
// and the forms agree. Bounds are in SI and match the database's check constraints
// (migrations/20261203000100_weather_log.ts); `decimals` is the precision the column keeps.

export const weatherValueKeys = [
  'tMinC',
  'tMaxC',
  'rainMm',
  'rhMinPct',
  'rhMaxPct',
  'rhMeanPct',
  'windMs',
  'windHeightM',
  'sunshineH',
  'solarMjM2',
] as const;
export type WeatherValueKey = (typeof weatherValueKeys)[number];

export interface WeatherQuantity {
  key: WeatherValueKey;
  /** The column in the database. */
  column: string;
  /** The column in CSV files. */
  csv: string;
  kind: WeatherKind;
  min: number;
  max: number;
  /** Decimals kept in SI. */
  decimals: number;
  /** What a person calls it. */
  label: string;
}

/**
 * Sane ranges for a garden's daily weather. Temperatures −60 to 60 °C take in every air temperature
 * recorded at a garden's height on Earth with room to spare (from memory: the records are about −89 °C
 * in Antarctica and 57 °C in Death Valley, neither a garden); 1000 mm is more rain than any day a site
 * would log (from memory); relative humidity is 0–100 % by definition; a day has 24 hours; 50 MJ/m² is
 * above the clear-sky solar radiation any day can bring (FAO-56, Chapter 3, ≈ 0.75 × extraterrestrial,
 * whose summer maximum is about 45 MJ/m², from memory); wind up to 100 m/s and a sensor 0.5–100 m up
 * bound typing slips, not weather (common practice).
 */
export const weatherQuantities: readonly WeatherQuantity[] = [
  { key: 'tMinC', column: 't_min_c', csv: 't_min', kind: 'temperature', min: -60, max: 60, decimals: 2, label: 'Lowest temperature' },
  { key: 'tMaxC', column: 't_max_c', csv: 't_max', kind: 'temperature', min: -60, max: 60, decimals: 2, label: 'Highest temperature' },
  { key: 'rainMm', column: 'rain_mm', csv: 'rain', kind: 'rain', min: 0, max: 1000, decimals: 3, label: 'Rain' },
  { key: 'rhMinPct', column: 'rh_min_pct', csv: 'rh_min', kind: 'percent', min: 0, max: 100, decimals: 1, label: 'Lowest humidity' },
  { key: 'rhMaxPct', column: 'rh_max_pct', csv: 'rh_max', kind: 'percent', min: 0, max: 100, decimals: 1, label: 'Highest humidity' },
  { key: 'rhMeanPct', column: 'rh_mean_pct', csv: 'rh_mean', kind: 'percent', min: 0, max: 100, decimals: 1, label: 'Mean humidity' },
  { key: 'windMs', column: 'wind_ms', csv: 'wind', kind: 'speed', min: 0, max: 100, decimals: 3, label: 'Wind speed' },
  { key: 'windHeightM', column: 'wind_height_m', csv: 'wind_height', kind: 'height', min: 0.5, max: 100, decimals: 3, label: 'Wind sensor height' },
  { key: 'sunshineH', column: 'sunshine_h', csv: 'sunshine_hours', kind: 'hours', min: 0, max: 24, decimals: 2, label: 'Sunshine' },
  { key: 'solarMjM2', column: 'solar_mj_m2', csv: 'solar_radiation', kind: 'solar', min: 0, max: 50, decimals: 2, label: 'Solar radiation' },
];

export const weatherQuantity = Object.fromEntries(weatherQuantities.map((q) => [q.key, q])) as Record<WeatherValueKey, WeatherQuantity>;

/** The bounds of a quantity in `units`, rounded outwards to what a person would type (−76 to 140 °F). */
export function boundsIn(q: WeatherQuantity, units: UnitSystem): { min: number; max: number } {
  const a = weatherFromSi(q.kind, q.min, units);
  const b = weatherFromSi(q.kind, q.max, units);
  return { min: roundTo(a, 2), max: roundTo(b, 2) };
}

/** A value typed in `units` as the SI value kept, at the column's precision. */
export function storedSi(q: WeatherQuantity, value: number, units: UnitSystem): number {
  return roundTo(weatherToSi(q.kind, value, units), q.decimals);
}

/**
 * What is wrong with a value typed in `units` (a message naming those units), or null when it fits.
 * The check is on the value as it will be stored, so a bound typed in feet or °F is never refused by
 * a rounding hair.
 */
export function rangeProblem(q: WeatherQuantity, value: number, units: UnitSystem): string | null {
  const si = storedSi(q, value, units);
  const unit = weatherUnitLabel(q.kind, units);
  const { min, max } = boundsIn(q, units);
  if (si < q.min) return `At least ${min} ${unit}`;
  if (si > q.max) return `At most ${max} ${unit}`;
  return null;
}

export type WeatherValues = Record<WeatherValueKey, number | null>;

/**
 * Problems between the values of one day, keyed by the value to mark: the lowest temperature above the
 * highest, the lowest humidity above the highest, or a mean outside them. Unit-free, so the same words
 * fit a form in °F and a file in °C.
 */
export function crossFieldProblems(v: Partial<WeatherValues>): Partial<Record<WeatherValueKey, string>> {
  const out: Partial<Record<WeatherValueKey, string>> = {};
  const has = (x: number | null | undefined): x is number => typeof x === 'number';
  if (has(v.tMinC) && has(v.tMaxC) && v.tMinC > v.tMaxC) out.tMinC = 'The lowest temperature is above the highest';
  if (has(v.rhMinPct) && has(v.rhMaxPct) && v.rhMinPct > v.rhMaxPct) out.rhMinPct = 'The lowest humidity is above the highest';
  if (has(v.rhMeanPct) && ((has(v.rhMinPct) && v.rhMeanPct < v.rhMinPct) || (has(v.rhMaxPct) && v.rhMeanPct > v.rhMaxPct))) {
    out.rhMeanPct = 'The mean humidity is outside the lowest and highest';
  }
  return out;
}

/** True when a day holds no value at all. */
export function isEmptyDay(v: Partial<WeatherValues>): boolean {
  return weatherValueKeys.every((k) => v[k] === null || v[k] === undefined);
}
