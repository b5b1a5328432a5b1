import { describe, expect, it } from 'vitest';
import { plusDays } from '../plot-book/dates';
import { et0ForDay, type Et0Result, type WeatherDay } from './et0';
import { kcOnDay } from './kc';
import { BED_FACTOR_DEFAULTS, needDay, weeklyNeed, type NeedDay } from './need';

const pm = (mm: number): Et0Result => ({ mm, method: 'penman_monteith', note: '' });

/** Seven days from 2026-07-06 with the given ET0, Kc, factor and rain on each day. */
function week(et0: (i: number) => Et0Result, kc: number, factor: number, rain: (i: number) => number | null): NeedDay[] {
  return Array.from({ length: 7 }, (_, i) => needDay({ date: plusDays('2026-07-06', i), et0: et0(i), kc, factor, rainMm: rain(i) }));
}

describe('needDay (FAO-56 Eq. 56: ETc = Kc ET0, times the bed factor)', () => {
  it('multiplies ET0 by Kc and the bed factor', () => {
    // computed: 4 × 0.85 × 1.2 = 4.08
    const d = needDay({ date: '2026-07-06', et0: pm(4), kc: 0.85, factor: 1.2, rainMm: 2 });
    expect(d.needMm).toBeCloseTo(4.08, 12);
    expect(d.rainMm).toBe(2);
    expect(d.factor).toBe(1.2);
  });

  it('counts rain not logged as none, and takes factor 1 when none is given', () => {
    const d = needDay({ date: '2026-07-06', et0: pm(3), kc: 1, rainMm: null });
    expect(d.rainMm).toBe(0);
    expect(d.factor).toBe(1);
    expect(d.needMm).toBe(3);
  });

  it('refuses a negative Kc, a factor of 0 or less and negative rain', () => {
    expect(() => needDay({ date: '2026-07-06', et0: pm(3), kc: -0.1, rainMm: 0 })).toThrow(RangeError);
    expect(() => needDay({ date: '2026-07-06', et0: pm(3), kc: 1, factor: 0, rainMm: 0 })).toThrow(RangeError);
    expect(() => needDay({ date: '2026-07-06', et0: pm(3), kc: 1, rainMm: -1 })).toThrow(RangeError);
  });

  it('works from a logged day to a day\'s need: Brussels ET0 3.88 × lettuce Kc 0.85 on day 35', () => {
    // FAO-56 Example 18 (ET0 3.88 mm/day) and Eq. 66 (lettuce day 35: 0.85); product computed: 3.298 mm
    const day: WeatherDay = { date: '2026-07-06', tMinC: 12.3, tMaxC: 21.5, rainMm: 1.5, rhMaxPct: 84, rhMinPct: 63, windMs: 10 / 3.6, windHeightM: 10, sunshineH: 9.25 };
    const et0 = et0ForDay(day, { latitude: 50.8, elevationM: 100 });
    const kc = kcOnDay({ initial: 0.7, mid: 1.0, end: { min: 0.95, max: 0.95 } }, { initial: 20, development: 30, mid: 15, late: 10 }, 35).kc;
    const d = needDay({ date: day.date, et0, kc, rainMm: day.rainMm });
    expect(d.needMm).toBeCloseTo(et0.mm * 0.85, 12);
    expect(Math.abs(d.needMm - 3.88 * 0.85)).toBeLessThanOrEqual(0.005); // FAO's 3.88 is printed to two decimals
    expect(d.rainMm).toBe(1.5);
  });
});

describe('weeklyNeed', () => {
  it('sums the days and sets the rain against the need', () => {
    // computed: 7 × 3.4 = 23.8 mm need, 9 mm rain, deficit 14.8 mm
    const w = weeklyNeed(week(() => pm(3.4), 1, 1, (i) => (i === 2 ? 9 : 0)));
    expect(w.needMm).toBeCloseTo(23.8, 12);
    expect(w.rainMm).toBe(9);
    expect(w.deficitMm).toBeCloseTo(14.8, 12);
  });

  it('has no deficit when the rain covers the need', () => {
    // computed: need 7 × 2 = 14 mm, rain 20 mm → deficit max(0, −6) = 0
    const w = weeklyNeed(week(() => pm(2), 1, 1, (i) => (i === 0 ? 20 : 0)));
    expect(w.needMm).toBeCloseTo(14, 12);
    expect(w.deficitMm).toBe(0);
  });

  it('gives about 25 mm for a week with nothing logged, at Kc 1 (rule of thumb, UF/IFAS, Purdue, University of Minnesota Extension)', () => {
    // computed: 7 × 25/7 = 25
    const w = weeklyNeed(week(() => et0ForDay(null, { latitude: 50.8, elevationM: null }), 1, 1, () => null));
    expect(w.needMm).toBeCloseTo(25, 12);
    expect(w.deficitMm).toBeCloseTo(25, 12);
  });

  it('is zero for no days', () => {
    expect(weeklyNeed([])).toEqual({ needMm: 0, rainMm: 0, deficitMm: 0 });
  });
});

describe('BED_FACTOR_DEFAULTS (our own defaults, not published values)', () => {
  it('leaves the ground as it is and makes raised beds, then containers, dry faster (common practice; the figures are ours)', () => {
    expect(BED_FACTOR_DEFAULTS.in_ground).toBe(1); // by definition: the need as computed
    expect(BED_FACTOR_DEFAULTS.raised_bed).toBeGreaterThan(1);
    expect(BED_FACTOR_DEFAULTS.container).toBeGreaterThan(BED_FACTOR_DEFAULTS.raised_bed);
  });
});
