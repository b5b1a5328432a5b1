import type { Et0Method, Et0Result } from './et0';

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
 * One day's need: ETc = Kc × ET0 (FAO-56 Eq. 56, number from memory) times the bed factor. Rain not
 * logged (null) counts as none. The task generator passes Kc 1 on a rule-of-thumb day: about 25 mm a
 * week is already a crop's need (common practice), not a reference to scale.
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
