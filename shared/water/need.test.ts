import { describe, expect, it } from 'vitest';
import { plusDays } from '../plot-book/dates';
import { et0ForDay, type Et0Result, type WeatherDay } from './et0';
import { kcOnDay } from './kc';
import { BED_FACTOR_DEFAULTS, explainWeek, needDay, weeklyNeed, type NeedDay } from './need';

const pm = (mm: number): Et0Result => ({ mm, method: 'penman_monteith', note: '' });
const hg = (mm: number): Et0Result => ({ mm, method: 'hargreaves', note: '' });

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

describe('explainWeek', () => {
  const lettuceWeek = week(() => pm(3.4), 1, 1, (i) => (i === 2 ? 9 : 0));

  it('reads a metric week with its numbers', () => {
    // computed: need 23.8 → 24 mm, rain 9 mm, deficit 14.8 → 15 mm, 14.8 mm × 3 m² = 44.4 → 44 L
    expect(explainWeek({ cropName: 'lettuce', areaM2: 3, units: 'metric', days: lettuceWeek })).toBe(
      'Need 24 mm this week (lettuce, Kc 1.00 × ET0 3.4 mm/day × 7 days, FAO-56 Penman-Monteith), rain logged 9 mm, deficit 15 mm: 44 L over this 3 m² bed',
    );
  });

  it('reads the same week in inches, ft² and US gallons', () => {
    // computed: 23.8 mm = 0.937 in, 3.4 mm = 0.134 in, 9 mm = 0.354 in, 14.8 mm = 0.583 in;
    // 3 m² = 32.29 ft² (÷ 0.09290304); 44.4 L = 11.73 US gal (÷ 3.785411784)
    expect(explainWeek({ cropName: 'lettuce', areaM2: 3, units: 'us', days: lettuceWeek })).toBe(
      'Need 0.94 in this week (lettuce, Kc 1.00 × ET0 0.13 in/day × 7 days, FAO-56 Penman-Monteith), rain logged 0.35 in, deficit 0.58 in: 12 US gal over this 32.3 ft² bed',
    );
  });

  it('names each method with its days, shows a bed factor and means Kc and ET0', () => {
    // computed: ET0 5 days at 4 and 2 days at 3 → mean 3.714 → 3.7; need Σ 0.85 × ET0 × 1.2 = 0.85 × 26 × 1.2 = 26.52 → 27 mm;
    // no rain, deficit 26.52 mm over 2 m² = 53.04 → 53 L
    const days = week((i) => (i < 5 ? pm(4) : hg(3)), 0.85, 1.2, () => 0);
    expect(explainWeek({ cropName: 'carrot', areaM2: 2, units: 'metric', days, place: 'raised bed' })).toBe(
      'Need 27 mm this week (carrot, Kc 0.85 × ET0 3.7 mm/day × 7 days × bed factor 1.2, FAO-56 Penman-Monteith 5 days, Hargreaves (FAO-56 Eq. 52) 2 days), rain logged 0 mm, deficit 27 mm: 53 L over this 2 m² raised bed',
    );
  });

  it('says when the rule of thumb was used, and keeps a decimal on small amounts', () => {
    // computed: 2 days × 25/7 × Kc 0.7 = 5.0 mm, rain 4.6 mm, deficit 0.4 mm; 0.4 mm × 1.5 m² = 0.6 L
    const days = [0, 1].map((i) => needDay({ date: plusDays('2026-05-01', i), et0: et0ForDay(null, { latitude: 0, elevationM: null }), kc: 0.7, rainMm: i === 0 ? 4.6 : 0 }));
    expect(explainWeek({ cropName: 'radish', areaM2: 1.5, units: 'metric', days })).toBe(
      'Need 5 mm this week (radish, Kc 0.70 × ET0 3.6 mm/day × 2 days, the rule of thumb of about 25 mm (1 inch) a week, not a computation), rain logged 4.6 mm, deficit 0.4 mm: 0.6 L over this 1.5 m² bed',
    );
  });

  it('says so when there are no days to count', () => {
    expect(explainWeek({ cropName: 'lettuce', areaM2: 3, units: 'metric', days: [] })).toMatch(/^No days of this week to count/);
  });
});
