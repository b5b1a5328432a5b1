import type { UnitSystem } from '../geometry/units';
import { roundTo } from '../geometry/units';

// Harvest weights are stored in grams; pounds and ounces exist only at the edge. Exact definitions
// from NIST Handbook 44, Appendix C: 1 lb (avoirdupois) = 0.453 592 37 kg, 1 oz = 1/16 lb.

/** Grams in one avoirdupois pound (exact). */
export const GRAMS_PER_POUND = 453.59237;
/** Ounces in one pound. */
export const OUNCES_PER_POUND = 16;
/** Grams in one avoirdupois ounce (exact: 453.59237 / 16 = 28.349523125). */
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND / OUNCES_PER_POUND;

export type WeightUnit = 'g' | 'kg' | 'oz' | 'lb';

const GRAMS_PER: Record<WeightUnit, number> = { g: 1, kg: 1000, oz: GRAMS_PER_OUNCE, lb: GRAMS_PER_POUND };

/** Converts a weight in `unit` to grams. */
export function toGrams(value: number, unit: WeightUnit): number {
  return value * GRAMS_PER[unit];
}

/** Converts grams to a weight in `unit`. */
export function fromGrams(grams: number, unit: WeightUnit): number {
  // Dividing by the exact factor keeps 453.59237 g → 1 lb exact.
  return grams / GRAMS_PER[unit];
}

/** One harvest record: a weight, a count of pieces, or both. */
export interface HarvestEntry {
  grams?: number;
  count?: number;
}

export interface HarvestTotals {
  grams: number;
  count: number;
  /** Null when the area is unknown or zero. */
  gramsPerM2: number | null;
  countPerM2: number | null;
  /** Null when the number of plants is unknown or zero. */
  gramsPerPlant: number | null;
  countPerPlant: number | null;
}

function per(total: number, by: number | undefined): number | null {
  return by !== undefined && by > 0 ? total / by : null;
}

/** A planting's harvest totals in grams and pieces, overall, per m² of its area and per plant. */
export function harvestTotals(entries: readonly HarvestEntry[], opts: { areaM2?: number; plants?: number } = {}): HarvestTotals {
  let grams = 0;
  let count = 0;
  for (const e of entries) {
    if (e.grams !== undefined) {
      if (!(e.grams >= 0) || !Number.isFinite(e.grams)) throw new RangeError(`A harvest weight cannot be ${e.grams}`);
      grams += e.grams;
    }
    if (e.count !== undefined) {
      if (!Number.isInteger(e.count) || e.count < 0) throw new RangeError(`A harvest count must be a whole number, got ${e.count}`);
      count += e.count;
    }
  }
  return {
    grams,
    count,
    gramsPerM2: per(grams, opts.areaM2),
    countPerM2: per(count, opts.areaM2),
    gramsPerPlant: per(grams, opts.plants),
    countPerPlant: per(count, opts.plants),
  };
}

/**
 * A weight in the site's units: "850 g" or "1.25 kg" (metric, kilograms from 1000 g), "12.5 oz"
 * or "2 lb 3 oz" (US, whole ounces once there is a pound).
 */
export function formatWeight(grams: number, units: UnitSystem): string {
  if (units === 'metric') {
    // Round first so 999.6 g shows as "1 kg", not "1000 g".
    const whole = roundTo(grams, 0);
    return whole >= 1000 ? `${roundTo(grams / 1000, 2)} kg` : `${whole} g`;
  }
  const ounces = fromGrams(grams, 'oz');
  if (ounces < OUNCES_PER_POUND) {
    const shown = roundTo(ounces, 1);
    if (shown < OUNCES_PER_POUND) return `${shown} oz`;
  }
  const wholeOunces = Math.round(Number(ounces.toPrecision(12)));
  const lb = Math.floor(wholeOunces / OUNCES_PER_POUND);
  const oz = wholeOunces % OUNCES_PER_POUND;
  return oz === 0 ? `${lb} lb` : `${lb} lb ${oz} oz`;
}
