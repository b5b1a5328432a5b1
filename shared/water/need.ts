import { roundTo, formatArea, type UnitSystem } from '../geometry/units';
import type { Et0Method, Et0Result } from './et0';
import { inchesFromMm, litresFor, usGallonsFromLitres } from './units';

// A planting's water need: ET0 × Kc × the bed's factor, day by day, summed over a week and set
// against the rain logged (FAO-56, Chapter 6: ETc = Kc ET0; Eq. 56, the number from memory).

/**
 * How much faster the soil dries in a raised bed or a container than in the ground, as a multiplier of
 * the need. Our own defaults, NOT published values: it is common practice that raised beds and
 * containers dry out faster than open ground (more exposed sides, less soil below), but no figure for
 * how much faster is known to us. A club can change them (its own setting); these are only what a club
 * starts with.
 */
export const BED_FACTOR_DEFAULTS = {
  in_ground: 1,
  /** Our own default (common practice that raised beds dry faster; the figure is ours). */
  raised_bed: 1.2,
  /** Our own default (common practice that containers dry faster still; the figure is ours). */
  container: 1.5,
} as const satisfies Record<string, number>;

export type BedKind = keyof typeof BED_FACTOR_DEFAULTS;

/** One day of a planting's need. `needMm` = `et0.mm` × `kc` × `factor` (build it with `needDay`). */
export interface NeedDay {
  date: string;
  et0: Et0Result;
  kc: number;
  factor: number;
  needMm: number;
  rainMm: number;
}

/**
 * One day's need: ETc = Kc × ET0 (FAO-56 Eq. 56, number from memory) times the bed factor. The rule of thumb's 25/7 mm
 * stands in for ET0 like any other method, so Kc scales it too. Rain not logged (null) counts as none.
 */
export function needDay(input: { date: string; et0: Et0Result; kc: number; factor?: number; rainMm: number | null | undefined }): NeedDay {
  const factor = input.factor ?? 1;
  if (!Number.isFinite(input.kc) || input.kc < 0) throw new RangeError(`Kc must be zero or more, got ${input.kc}`);
  if (!Number.isFinite(factor) || factor <= 0) throw new RangeError(`The bed factor must be above 0, got ${factor}`);
  const rain = input.rainMm ?? 0;
  if (!Number.isFinite(rain) || rain < 0) throw new RangeError(`Rain must be zero or more mm, got ${input.rainMm}`);
  return { date: input.date, et0: input.et0, kc: input.kc, factor, needMm: input.et0.mm * input.kc * factor, rainMm: rain };
}

/** A week's need and rain, summed over its days; the deficit is max(0, need − rain). */
export function weeklyNeed(days: NeedDay[]): { needMm: number; rainMm: number; deficitMm: number } {
  let needMm = 0;
  let rainMm = 0;
  for (const d of days) {
    needMm += d.needMm;
    rainMm += d.rainMm;
  }
  return { needMm, rainMm, deficitMm: Math.max(0, needMm - rainMm) };
}

/** How each ET0 method is named to a person. */
export const ET0_METHOD_WORDS: Record<Et0Method, string> = {
  penman_monteith: 'FAO-56 Penman-Monteith',
  hargreaves: 'Hargreaves (FAO-56 Eq. 52)',
  rule_of_thumb: 'the rule of thumb of about 25 mm (1 inch) a week, not a computation',
};

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
/** Whole units from 10 up, one decimal below (so 0.4 mm does not read as 0 mm). */
const amount = (v: number) => String(roundTo(v, Math.abs(v) >= 10 ? 0 : 1));

function depth(mm: number, units: UnitSystem): string {
  return units === 'us' ? `${roundTo(inchesFromMm(mm), 2)} in` : `${amount(mm)} mm`;
}

/**
 * A week's water in words with its numbers, e.g. "Need 24 mm this week (lettuce, Kc 1.00 × ET0
 * 3.4 mm/day × 7 days, FAO-56 Penman-Monteith), rain logged 9 mm, deficit 15 mm: 44 L over this
 * 3 m² bed". Kc and ET0 are the means over the days (their product times the days is close to, not
 * always exactly, the sum of the days' needs); a bed factor other than 1 is shown; the methods are
 * named, with their number of days when more than one was used. US units: inches, in/day, ft² and US
 * gallons. The volume is the deficit over `areaM2`.
 */
export function explainWeek(input: { cropName: string; areaM2: number; units: UnitSystem; days: NeedDay[]; place?: string }): string {
  const { cropName, areaM2, units, days } = input;
  const place = input.place ?? 'bed';
  const where = `over this ${formatArea(areaM2, units, 1)} ${place}`;
  if (days.length === 0) return `No days of this week to count (${cropName}): nothing to water ${where}.`;
  const week = weeklyNeed(days);
  const kc = mean(days.map((d) => d.kc));
  const et0 = mean(days.map((d) => d.et0.mm));
  const factors = days.map((d) => d.factor);
  const factor = mean(factors);
  const counts = new Map<Et0Method, number>();
  for (const d of days) counts.set(d.et0.method, (counts.get(d.et0.method) ?? 0) + 1);
  const methods = [...counts]
    .map(([m, n]) => (counts.size > 1 ? `${ET0_METHOD_WORDS[m]} ${n} ${n === 1 ? 'day' : 'days'}` : ET0_METHOD_WORDS[m]))
    .join(', ');
  const et0Words = units === 'us' ? `${roundTo(inchesFromMm(et0), 2)} in/day` : `${roundTo(et0, 1)} mm/day`;
  const factorWords = factors.some((f) => f !== 1) ? ` × bed factor ${roundTo(factor, 2)}` : '';
  const litres = litresFor(week.deficitMm, areaM2);
  const volume = units === 'us' ? `${amount(usGallonsFromLitres(litres))} US gal` : `${amount(litres)} L`;
  const nDays = `${days.length} ${days.length === 1 ? 'day' : 'days'}`;
  return (
    `Need ${depth(week.needMm, units)} this week (${cropName}, Kc ${kc.toFixed(2)} × ET0 ${et0Words} × ${nDays}${factorWords}, ${methods}), ` +
    `rain logged ${depth(week.rainMm, units)}, deficit ${depth(week.deficitMm, units)}: ${volume} ${where}`
  );
}
