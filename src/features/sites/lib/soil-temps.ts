import { roundTo, type UnitSystem } from '@shared/geometry';

// The form shows soil temperatures in °C on metric sites and °F on US-unit sites; the API always
// takes °C. The conversion is the exact one in NIST SP 811 (2008 edition), Appendix B:
// t/°F = t/°C × 9/5 + 32, and back, t/°C = (t/°F − 32) × 5/9.

/** Months in a year; the table is January first. */
export const MONTHS = 12;

/** The form keeps tenths of a degree: finer than any soil thermometer a club owns (common practice). */
export const TEMPERATURE_DECIMALS = 1;

/** The server's bounds, °C (shared/schemas/sites.ts). */
export const MIN_SOIL_TEMP_C = -30;
export const MAX_SOIL_TEMP_C = 50;

/** Degrees Celsius as degrees Fahrenheit (NIST SP 811: °F = °C × 9/5 + 32). */
export function celsiusToFahrenheit(c: number): number {
  return (c * 9) / 5 + 32;
}

/** Degrees Fahrenheit as degrees Celsius (NIST SP 811: °C = (°F − 32) × 5/9). */
export function fahrenheitToCelsius(f: number): number {
  return ((f - 32) * 5) / 9;
}

/** The temperature unit shown for a unit system ("°C" or "°F"). */
export function temperatureUnitLabel(units: UnitSystem): string {
  return units === 'us' ? '°F' : '°C';
}

/** A stored °C value as the number shown in the given units, to a tenth. */
export function toDisplayTemperature(c: number, units: UnitSystem): number {
  return roundTo(units === 'us' ? celsiusToFahrenheit(c) : c, TEMPERATURE_DECIMALS);
}

/** A typed temperature in the given units as °C for the API, to a tenth. */
export function fromDisplayTemperature(value: number, units: UnitSystem): number {
  return roundTo(units === 'us' ? fahrenheitToCelsius(value) : value, TEMPERATURE_DECIMALS);
}

/** The server's bounds in the given units, e.g. −22..122 for °F. */
export function soilTempBounds(units: UnitSystem): { min: number; max: number } {
  return { min: toDisplayTemperature(MIN_SOIL_TEMP_C, units), max: toDisplayTemperature(MAX_SOIL_TEMP_C, units) };
}

/** The twelve inputs filled from a stored table (or all empty when there is none). */
export function soilTempsText(soilTempsC: readonly number[] | null, units: UnitSystem): string[] {
  if (!soilTempsC || soilTempsC.length !== MONTHS) return Array.from({ length: MONTHS }, () => '');
  return soilTempsC.map((c) => String(toDisplayTemperature(c, units)));
}

// Within a twentieth of a degree is the stored value re-read through the form's rounding, not an edit.
const SAME_TEMPERATURE_C = 0.05;

/** True when two tables are the same for the form's purposes (both missing, or every month within rounding). */
export function sameSoilTemps(a: readonly number[] | null, b: readonly number[] | null): boolean {
  if (a === null || b === null) return a === b;
  return a.length === b.length && a.every((c, i) => Math.abs(c - b[i]) < SAME_TEMPERATURE_C);
}
