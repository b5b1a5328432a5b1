import type { CropCoefficients, StageLengths } from '../crops/types';

// The crop coefficient Kc on a given day of the season, by growth stage (FAO-56, Chapter 6, Fig. 25
// and Eq. 66: Kc is flat through the initial and mid-season stages and changes linearly through
// development and the late season).

export type { CropCoefficients, StageLengths };

export type GrowthStage = 'initial' | 'development' | 'mid' | 'late' | 'after';

/**
 * The Kc end to use. FAO-56 Table 12 prints a range for some crops (tomato 0.70–0.90, depending on how
 * ripe the crop is harvested); we take the middle of the range (our own choice: the table gives no
 * rule, and a garden picks over weeks rather than all at one ripeness). Where min equals max it is
 * the printed value.
 */
export function kcEnd(kc: CropCoefficients): number {
  return (kc.end.min + kc.end.max) / 2;
}

function checkStages(stages: StageLengths): void {
  for (const [name, days] of Object.entries(stages)) {
    if (!Number.isFinite(days) || days < 0) throw new RangeError(`Stage ${name} must be zero or more days, got ${days}`);
  }
}

/**
 * Linear interpolation within a stage (FAO-56 Eq. 66):
 * Kc i = Kc prev + [(i − Σ L prev) / L stage] (Kc next − Kc prev).
 */
export function interpolateKc(kcPrev: number, kcNext: number, dayInSeason: number, stageStartDay: number, stageLength: number): number {
  if (stageLength <= 0) return kcNext;
  return kcPrev + ((dayInSeason - stageStartDay) / stageLength) * (kcNext - kcPrev);
}

/**
 * The crop coefficient `daysSincePlanting` days after sowing or planting out (day 0 is the planting day),
 * with the stage it falls in. Stages are half-open: with lettuce's 20/30/15/10 days (FAO-56 Table 11),
 * days 0–19 are initial, 20–49 development, 50–64 mid, 65–74 late and day 75 on is after the season.
 * Initial: Kc ini; development: Kc ini → Kc mid (Eq. 66); mid: Kc mid; late: Kc mid → Kc end (Eq. 66);
 * after: Kc end. Kc end is the middle of a printed range (`kcEnd`). A negative day (a planting still
 * ahead) is treated as initial.
 */
export function kcOnDay(kc: CropCoefficients, stages: StageLengths, daysSincePlanting: number): { kc: number; stage: GrowthStage } {
  if (!Number.isFinite(daysSincePlanting)) throw new RangeError(`Days since planting must be a number, got ${daysSincePlanting}`);
  checkStages(stages);
  const end = kcEnd(kc);
  const d = Math.max(0, daysSincePlanting);
  const devStart = stages.initial;
  const midStart = devStart + stages.development;
  const lateStart = midStart + stages.mid;
  const seasonEnd = lateStart + stages.late;
  if (d < devStart) return { kc: kc.initial, stage: 'initial' };
  if (d < midStart) return { kc: interpolateKc(kc.initial, kc.mid, d, devStart, stages.development), stage: 'development' };
  if (d < lateStart) return { kc: kc.mid, stage: 'mid' };
  if (d < seasonEnd) return { kc: interpolateKc(kc.mid, end, d, lateStart, stages.late), stage: 'late' };
  return { kc: end, stage: 'after' };
}
