import type { Crop, EmergenceTable, Germination, Range } from '../crops/types';

/** The soil temperatures (°C) of the Harrington table's five columns (printed as 50/59/68/77/86 °F). */
export const EMERGENCE_TABLE_TEMPERATURES_C = [10, 15, 20, 25, 30] as const;

export type EmergenceEstimate =
  | {
      comesUp: true;
      /** Expected days to emergence, unrounded (interpolated from the table, or the range's midpoint). */
      days: number;
      /** Whole days, for dates: `days` rounded half up. */
      expectedDays: number;
      /** The whole-day range: the crop's range without a table; with a table, `days` rounded down and up. */
      rangeDays: Range;
      basis: 'table' | 'range';
      /**
       * Set when the soil is outside the table's 10–30 °C and the end column was used: below 10 °C the
       * true wait is longer than shown, above 30 °C it may be shorter or the seed may suffer.
       */
      clamped?: 'below_table' | 'above_table';
    }
  | { comesUp: false; reason: 'too_cold' | 'too_hot' };

/**
 * Days to emergence at `soilC` from a Harrington table: linear between columns, the end column beyond
 * 10 or 30 °C, and null where the seed does not come up (below the first column it comes up at, above
 * the last, or at a `null` column's side of an interval).
 */
export function daysFromTable(table: EmergenceTable, soilC: number): number | null {
  const temps = EMERGENCE_TABLE_TEMPERATURES_C;
  const first = table.findIndex((d) => d !== null);
  if (first === -1) return null;
  let last = table.length - 1;
  while (table[last] === null) last -= 1;
  if (soilC < temps[first]) return first === 0 ? table[0] : null;
  if (soilC > temps[last]) return last === table.length - 1 ? table[last] : null;
  for (let i = first; i < last; i += 1) {
    if (soilC >= temps[i] && soilC <= temps[i + 1]) {
      const lo = table[i];
      const hi = table[i + 1];
      if (lo === null || hi === null) return null;
      return lo + ((hi - lo) * (soilC - temps[i])) / (temps[i + 1] - temps[i]);
    }
  }
  return table[last];
}

function rounded(days: number): number {
  // Twelve significant digits first so 5.4999999999 from interpolation does not round the other way.
  return Math.floor(Number(days.toPrecision(12)) + 0.5);
}

/**
 * Expected days to emergence for a crop, at a soil temperature when one is known: from the crop's
 * table when it has one, otherwise the midpoint of its days-to-emergence range; no emergence at or
 * below the germination minimum or above its maximum.
 */
export function expectedEmergence(
  crop: Pick<Crop, 'daysToEmergence' | 'emergenceByTemperature'> & { germination: { value: Germination } },
  soilC?: number,
): EmergenceEstimate {
  const g = crop.germination.value;
  if (soilC !== undefined) {
    // At the minimum itself germination stalls, so no finite day count is given there.
    if (soilC <= g.minC) return { comesUp: false, reason: 'too_cold' };
    if (soilC > g.maxC) return { comesUp: false, reason: 'too_hot' };
    const table = crop.emergenceByTemperature?.value;
    if (table) {
      const days = daysFromTable(table, soilC);
      if (days === null) {
        const first = table.findIndex((d) => d !== null);
        const tooCold = first === -1 || soilC < EMERGENCE_TABLE_TEMPERATURES_C[first];
        return { comesUp: false, reason: tooCold ? 'too_cold' : 'too_hot' };
      }
      const clamped = soilC < EMERGENCE_TABLE_TEMPERATURES_C[0] ? 'below_table' : soilC > EMERGENCE_TABLE_TEMPERATURES_C[4] ? 'above_table' : undefined;
      return {
        comesUp: true,
        days,
        expectedDays: rounded(days),
        rangeDays: { min: Math.floor(Number(days.toPrecision(12))), max: Math.ceil(Number(days.toPrecision(12))) },
        basis: 'table',
        ...(clamped ? { clamped } : {}),
      };
    }
  }
  const range = crop.daysToEmergence.value;
  const mid = (range.min + range.max) / 2;
  return { comesUp: true, days: mid, expectedDays: rounded(mid), rangeDays: { min: range.min, max: range.max }, basis: 'range' };
}

/** Converts a soil temperature in °F to °C (°C = (°F − 32) × 5/9). */
export function fahrenheitToCelsius(f: number): number {
  return ((f - 32) * 5) / 9;
}
