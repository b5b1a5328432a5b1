import { describe, expect, it } from 'vitest';
import { gridPlantsPerSquareFoot, gridPlantsPerSquareMetre, plantsInArea, plantsInRows } from './spacing';

// Inches and feet to metric: 1 in = 2.54 cm, 1 ft = 0.3048 m exactly (NIST Handbook 44 Appendix C).
const IN_CM = 2.54;
const FT_M = 0.3048;

describe('plantsInRows', () => {
  it('fits 60 radishes in a 10 ft row thinned to 2 in', () => {
    // Values common practice (10 ft row, 2 in after thinning); result computed: 120 in / 2 in = 60.
    expect(plantsInRows({ rowLengthM: 10 * FT_M, rows: 1, inRowCm: 2 * IN_CM })).toEqual({ plants: 60, rows: 1, perRow: 60 });
  });

  it('multiplies by the number of rows', () => {
    // computed: 3 rows × 60
    expect(plantsInRows({ rowLengthM: 10 * FT_M, rows: 3, inRowCm: 2 * IN_CM }).plants).toBe(180);
  });

  it('gives each plant one spacing of row, with no extra plant at the ends', () => {
    // computed edge rule: floor(L / s). Exactly one spacing holds one plant; just short of it, none.
    expect(plantsInRows({ rowLengthM: 0.3, rows: 1, inRowCm: 30 }).perRow).toBe(1);
    expect(plantsInRows({ rowLengthM: 0.299, rows: 1, inRowCm: 30 }).perRow).toBe(0);
    // 1 m at 30 cm: 3.33… → 3 (computed)
    expect(plantsInRows({ rowLengthM: 1, rows: 1, inRowCm: 30 }).perRow).toBe(3);
    expect(plantsInRows({ rowLengthM: 0, rows: 2, inRowCm: 30 }).plants).toBe(0);
    // computed: 0.57 m at 19 cm is exactly 3, though 0.57 × 100 / 19 is 2.9999999999999996 in binary
    expect(plantsInRows({ rowLengthM: 0.57, rows: 1, inRowCm: 19 }).perRow).toBe(3);
    expect(plantsInRows({ rowLengthM: 0.29, rows: 1, inRowCm: 29 }).perRow).toBe(1);
  });

  it('refuses a spacing that is not positive and a fractional number of rows', () => {
    expect(() => plantsInRows({ rowLengthM: 1, rows: 1, inRowCm: 0 })).toThrow(RangeError);
    expect(() => plantsInRows({ rowLengthM: 1, rows: 1.5, inRowCm: 5 })).toThrow(RangeError);
    expect(() => plantsInRows({ rowLengthM: -1, rows: 1, inRowCm: 5 })).toThrow(RangeError);
  });
});

describe('plantsInArea', () => {
  it('fills a square foot with 16 carrots on a 3 in grid', () => {
    // University of Arizona Cooperative Extension, "Intensive gardening methods": carrot 2–3 in;
    // plants per ft² = (12/s)² = (12/3)² = 16 (computed).
    const fit = plantsInArea({ widthM: FT_M, lengthM: FT_M, method: 'intensive', equalSpacingCm: 3 * IN_CM });
    expect(fit.plants).toBe(16);
    expect(fit.plants).toBe(gridPlantsPerSquareFoot(3));
    expect(fit.areaM2).toBeCloseTo(0.09290304, 10); // 1 ft² = 0.09290304 m² (NIST Handbook 44 Appendix C)
  });

  it('fills a 4 × 8 ft bed on a 3 in grid at 16 per square foot', () => {
    // computed: 16 across × 32 along = 512 = 32 ft² × 16
    const fit = plantsInArea({ widthM: 4 * FT_M, lengthM: 8 * FT_M, method: 'intensive', equalSpacingCm: 3 * IN_CM });
    expect(fit).toMatchObject({ plants: 512, rows: 16, perRow: 32 });
  });

  it('loses the part-plants at the edges on a wide grid', () => {
    // Tomato 18 in (University of Arizona, low end of 18–24 in). (12/18)² × 32 ft² = 14.2 by density,
    // but floor(48/18) × floor(96/18) = 2 × 5 = 10 whole plants fit (computed, edge rule).
    expect(gridPlantsPerSquareFoot(18) * 32).toBeCloseTo(14.222, 3);
    expect(plantsInArea({ widthM: 4 * FT_M, lengthM: 8 * FT_M, method: 'intensive', equalSpacingCm: 18 * IN_CM }).plants).toBe(10);
  });

  it('runs rows along the longer side whichever way the bed is given', () => {
    // Carrots in rows: 12 in between rows, 2 in in the row (University of Maine planting chart, low ends).
    // 1.2 m across: floor(120 / 30.48) = 3 rows; 3 m along: floor(300 / 5.08) = 59 per row; 177 (computed).
    const a = plantsInArea({ widthM: 1.2, lengthM: 3, method: 'rows', inRowCm: 2 * IN_CM, betweenRowCm: 12 * IN_CM });
    const b = plantsInArea({ widthM: 3, lengthM: 1.2, method: 'rows', inRowCm: 2 * IN_CM, betweenRowCm: 12 * IN_CM });
    expect(a).toMatchObject({ plants: 177, rows: 3, perRow: 59, rowLengthM: 3 });
    expect(b).toEqual(a);
    expect(a.areaM2).toBeCloseTo(3.6, 10);
  });

  it('asks for the spacings its method needs', () => {
    expect(() => plantsInArea({ widthM: 1, lengthM: 2, method: 'rows', inRowCm: 5 })).toThrow(RangeError);
    expect(() => plantsInArea({ widthM: 1, lengthM: 2, method: 'intensive', inRowCm: 5, betweenRowCm: 30 })).toThrow(RangeError);
  });
});

describe('grid density', () => {
  it('gives (12/s)² per square foot and (100/s)² per square metre', () => {
    // University of Arizona formula (computed): head lettuce at 12 in → 1 per ft²; radish at 2 in → 36.
    expect(gridPlantsPerSquareFoot(12)).toBe(1);
    expect(gridPlantsPerSquareFoot(2)).toBe(36);
    // computed: 10 cm grid → 100 per m²; 25 cm → 16
    expect(gridPlantsPerSquareMetre(10)).toBeCloseTo(100, 10);
    expect(gridPlantsPerSquareMetre(25)).toBe(16);
  });
});
