import { describe, expect, it } from 'vitest';
import { cropBySlug } from '../crops/crops';
import { interpolateKc, kcEnd, kcOnDay, type CropCoefficients, type StageLengths } from './kc';

// Lettuce: FAO-56 Table 11 stage lengths 20/30/15/10 days and Table 12 Kc ini 0.7, mid 1.00, end 0.95.
const lettuceKc: CropCoefficients = { initial: 0.7, mid: 1.0, end: { min: 0.95, max: 0.95 } };
const lettuceStages: StageLengths = { initial: 20, development: 30, mid: 15, late: 10 };
// Tomato: FAO-56 Table 12 Kc ini 0.6, mid 1.15, end printed as a range 0.70–0.90; Table 11 stages 30/40/45/30.
const tomatoKc: CropCoefficients = { initial: 0.6, mid: 1.15, end: { min: 0.7, max: 0.9 } };
const tomatoStages: StageLengths = { initial: 30, development: 40, mid: 45, late: 30 };

describe('kcOnDay (FAO-56 Eq. 66)', () => {
  it('gives lettuce Kc 0.85 on day 35, halfway through development (computed: 0.7 + 15/30 × 0.30)', () => {
    expect(kcOnDay(lettuceKc, lettuceStages, 35)).toEqual({ kc: expect.closeTo(0.85, 12), stage: 'development' });
  });

  it('gives lettuce Kc 0.975 on day 70, halfway through the late season (computed: 1.00 + 5/10 × (0.95 − 1.00))', () => {
    expect(kcOnDay(lettuceKc, lettuceStages, 70)).toEqual({ kc: expect.closeTo(0.975, 12), stage: 'late' });
  });

  // Stage boundaries for lettuce (computed from 20/30/15/10: development starts on day 20, mid on 50,
  // late on 65, and the season ends after day 74).
  it.each([
    [0, 0.7, 'initial'],
    [19, 0.7, 'initial'],
    [20, 0.7, 'development'], // computed: Eq. 66 at i = ΣL prev gives Kc prev
    [49, 0.7 + (29 / 30) * 0.3, 'development'], // computed
    [50, 1.0, 'mid'],
    [64, 1.0, 'mid'],
    [65, 1.0, 'late'], // computed: Eq. 66 at the start of the late season gives Kc mid
    [74, 1.0 + (9 / 10) * (0.95 - 1.0), 'late'], // computed
    [75, 0.95, 'after'],
    [400, 0.95, 'after'],
  ] as const)('lettuce day %s: Kc %s, %s', (day, kc, stage) => {
    const r = kcOnDay(lettuceKc, lettuceStages, day);
    expect(r.stage).toBe(stage);
    expect(r.kc).toBeCloseTo(kc, 12);
  });

  it('is continuous across each boundary (Eq. 66 meets the flat stages)', () => {
    // computed: just before and at each boundary the values differ by at most one day's slope
    for (const boundary of [20, 50, 65, 75]) {
      const before = kcOnDay(lettuceKc, lettuceStages, boundary - 1e-9).kc;
      const at = kcOnDay(lettuceKc, lettuceStages, boundary).kc;
      expect(Math.abs(before - at)).toBeLessThan(1e-6);
    }
  });

  it('treats a planting still ahead (negative days) as the initial stage', () => {
    expect(kcOnDay(lettuceKc, lettuceStages, -5)).toEqual({ kc: 0.7, stage: 'initial' });
  });

  it('uses the middle of a printed end range: tomato 0.70–0.90 → 0.80 (our choice, documented in kcEnd)', () => {
    // computed: (0.70 + 0.90) / 2 = 0.80; tomato's season is 30 + 40 + 45 + 30 = 145 days (FAO-56 Table 11)
    expect(kcEnd(tomatoKc)).toBeCloseTo(0.8, 12);
    expect(kcOnDay(tomatoKc, tomatoStages, 145)).toEqual({ kc: expect.closeTo(0.8, 12), stage: 'after' });
    // computed: halfway through the late season, 1.15 + 15/30 × (0.80 − 1.15) = 0.975
    expect(kcOnDay(tomatoKc, tomatoStages, 130).kc).toBeCloseTo(0.975, 12);
  });

  it('skips a stage of zero days', () => {
    // computed: no development stage, so mid starts on day 20 at Kc mid
    expect(kcOnDay(lettuceKc, { ...lettuceStages, development: 0 }, 20)).toEqual({ kc: 1.0, stage: 'mid' });
    expect(interpolateKc(0.7, 1.0, 20, 20, 0)).toBe(1.0);
  });

  it('refuses negative stage lengths and days that are not a number', () => {
    expect(() => kcOnDay(lettuceKc, { ...lettuceStages, mid: -1 }, 10)).toThrow(RangeError);
    expect(() => kcOnDay(lettuceKc, lettuceStages, Number.NaN)).toThrow(RangeError);
  });

  it('reads the catalogue\'s lettuce values the same way (shared/crops, FAO-56 Tables 11 and 12)', () => {
    const lettuce = cropBySlug('lettuce');
    expect(lettuce?.kc && lettuce.stages).toBeTruthy();
    // computed: the catalogue holds the same 0.7/1.00/0.95 and 20/30/15/10 as above, so day 35 is 0.85
    expect(kcOnDay(lettuce!.kc!.value, lettuce!.stages!.value, 35).kc).toBeCloseTo(0.85, 12);
  });
});
