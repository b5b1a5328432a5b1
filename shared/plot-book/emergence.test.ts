import { describe, expect, it } from 'vitest';
import type { EmergenceTable, Germination, Range, Sourced } from '../crops/types';
import { daysFromTable, expectedEmergence, fahrenheitToCelsius } from './emergence';

// Test fixtures, not crop data: built from sources.md section 7 (Harrington; OSU Extension
// min/optimum/max in °F; Harrington & Minges via Knott's Handbook days at 50/59/68/77/86 °F).
const HM = 'harrington-minges-knott';
const OSU = 'osu-soil-temperature';
const f = fahrenheitToCelsius;

function germ(minF: number, optLoF: number, optHiF: number, maxF: number): Sourced<Germination> {
  return { value: { minC: f(minF), optimumC: { min: f(optLoF), max: f(optHiF) }, maxC: f(maxF) }, source: OSU };
}
function fixture(g: Sourced<Germination>, daysToEmergence: Range, table?: EmergenceTable) {
  return {
    germination: g,
    daysToEmergence: { value: daysToEmergence, source: 'common_practice' },
    ...(table ? { emergenceByTemperature: { value: table, source: HM } } : {}),
  };
}

// radish 40/45–90/95 °F; 11/6/4/4/3 days; 5–10 days to emergence (common practice)
const radish = fixture(germ(40, 45, 90, 95), { min: 5, max: 10 }, [11, 6, 4, 4, 3]);
// tomato 50/60–85/95 °F; 43/14/8/6/6 days. The range 6–14 is from memory (fixture only).
const tomato = fixture(germ(50, 60, 85, 95), { min: 6, max: 14 }, [43, 14, 8, 6, 6]);
// snap bean 60/60–85/95 °F; none/16/11/8/6 days. Range 7–14 from memory (fixture only).
const bean = fixture(germ(60, 60, 85, 95), { min: 7, max: 14 }, [null, 16, 11, 8, 6]);
// lettuce 35/40–80/95 °F; 7/4/3/2/3 days
const lettuce = fixture(germ(35, 40, 80, 95), { min: 7, max: 10 }, [7, 4, 3, 2, 3]);

describe('daysFromTable', () => {
  it('reads the published columns as they are', () => {
    // Harrington & Minges via Knott's Handbook, radish row
    expect([10, 15, 20, 25, 30].map((t) => daysFromTable([11, 6, 4, 4, 3], t))).toEqual([11, 6, 4, 4, 3]);
    // pepper row: none/25/13/8/8
    expect(daysFromTable([null, 25, 13, 8, 8], 20)).toBe(13);
  });

  it('interpolates linearly between columns', () => {
    // computed from the carrot row 17/10/7/6/6: halfway between 10 and 15 °C → 13.5
    expect(daysFromTable([17, 10, 7, 6, 6], 12.5)).toBeCloseTo(13.5, 10);
    // computed from the tomato row: 14 at 15 °C, 8 at 20 °C; 16 °C → 14 − 6 × 1/5 = 12.8
    expect(daysFromTable([43, 14, 8, 6, 6], 16)).toBeCloseTo(12.8, 10);
    // lettuce row rises again from 25 to 30 °C: 27.5 → 2.5 (computed)
    expect(daysFromTable([7, 4, 3, 2, 3], 27.5)).toBeCloseTo(2.5, 10);
  });

  it('clamps outside 10–30 °C and gives null where the seed does not come up', () => {
    expect(daysFromTable([11, 6, 4, 4, 3], 6)).toBe(11);
    expect(daysFromTable([11, 6, 4, 4, 3], 34)).toBe(3);
    // snap bean: none at 10 °C, so nothing below 15 °C, not even between the columns
    expect(daysFromTable([null, 16, 11, 8, 6], 12)).toBeNull();
    expect(daysFromTable([null, 16, 11, 8, 6], 15)).toBe(16);
    // synthetic row (not published) for a seed that stops coming up in heat
    expect(daysFromTable([5, 4, 3, null, null], 22)).toBeNull();
    expect(daysFromTable([5, 4, 3, null, null], 31)).toBeNull();
  });
});

describe('expectedEmergence', () => {
  it('expects radish at 60 °F soil in about 6 days, inside the usual 5–10', () => {
    // 60 °F = 15.56 °C; between 6 days (15 °C) and 4 days (20 °C): 6 − 2 × 0.556/5 = 5.78 (computed
    // from Harrington & Minges); common practice emergence 5–10 days.
    const e = expectedEmergence(radish, f(60));
    if (!e.comesUp) throw new Error('expected emergence');
    expect(e.days).toBeCloseTo(5.778, 3);
    expect(e.expectedDays).toBe(6);
    expect(e.rangeDays).toEqual({ min: 5, max: 6 });
    expect(e.basis).toBe('table');
    expect(e.days).toBeGreaterThanOrEqual(5);
    expect(e.days).toBeLessThanOrEqual(10);
  });

  it('marks a clamped reading and refuses soil at or below the minimum or above the maximum', () => {
    // radish minimum 40 °F = 4.44 °C, maximum 95 °F = 35 °C (OSU Extension)
    expect(expectedEmergence(radish, 7)).toMatchObject({ comesUp: true, days: 11, clamped: 'below_table' });
    expect(expectedEmergence(radish, 33)).toMatchObject({ comesUp: true, days: 3, clamped: 'above_table' });
    expect(expectedEmergence(radish, f(40))).toEqual({ comesUp: false, reason: 'too_cold' });
    expect(expectedEmergence(radish, 4.5)).toMatchObject({ comesUp: true, days: 11 });
    expect(expectedEmergence(radish, 35)).toMatchObject({ comesUp: true });
    expect(expectedEmergence(radish, 35.5)).toEqual({ comesUp: false, reason: 'too_hot' });
  });

  it('lets the germination minimum win over a table column at the same temperature', () => {
    // Tomato: Harrington & Minges print 43 days at 50 °F, which is also OSU's minimum (50 °F): at the
    // minimum we give no day count; just above it the table applies: 43 − 29 × 0.5/5 = 40.1 (computed).
    expect(expectedEmergence(tomato, 10)).toEqual({ comesUp: false, reason: 'too_cold' });
    expect(expectedEmergence(tomato, 10.5)).toMatchObject({ comesUp: true, days: expect.closeTo(40.1, 6), expectedDays: 40 });
    // Snap bean: 16 days at 59 °F in the table, but the minimum is 60 °F (15.56 °C).
    expect(expectedEmergence(bean, 15)).toEqual({ comesUp: false, reason: 'too_cold' });
    // 17.5 °C → 16 − 5 × 0.5 = 13.5 → 14 days, half rounded up (computed)
    expect(expectedEmergence(bean, 17.5)).toMatchObject({ comesUp: true, expectedDays: 14, rangeDays: { min: 13, max: 14 } });
  });

  it('rounds interpolated days for dates', () => {
    // lettuce 27.5 °C → 2.5 days → 3 (computed, half up)
    expect(expectedEmergence(lettuce, 27.5)).toMatchObject({ expectedDays: 3, rangeDays: { min: 2, max: 3 } });
  });

  it('falls back to the midpoint of the crop’s range without a table or a soil temperature', () => {
    // radish 5–10 days (common practice): midpoint 7.5, 8 whole days
    expect(expectedEmergence(radish)).toEqual({ comesUp: true, days: 7.5, expectedDays: 8, rangeDays: { min: 5, max: 10 }, basis: 'range' });
    const { emergenceByTemperature: _unused, ...noTable } = radish;
    void _unused;
    expect(expectedEmergence(noTable, f(60))).toMatchObject({ basis: 'range', expectedDays: 8 });
    // the germination minimum still applies without a table
    expect(expectedEmergence(noTable, 3)).toEqual({ comesUp: false, reason: 'too_cold' });
  });

  it('converts °F to °C', () => {
    // °C = (°F − 32) × 5/9 (NIST SP 811)
    expect(fahrenheitToCelsius(50)).toBe(10);
    expect(fahrenheitToCelsius(86)).toBe(30);
    expect(fahrenheitToCelsius(59)).toBeCloseTo(15, 10);
  });
});
