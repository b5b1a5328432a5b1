import { describe, expect, it } from 'vitest';
import { formatWeight, fromGrams, GRAMS_PER_OUNCE, GRAMS_PER_POUND, harvestTotals, toGrams } from './harvest';

describe('weight units', () => {
  it('uses the exact avoirdupois pound and ounce', () => {
    // NIST Handbook 44 Appendix C: 1 lb = 0.453 592 37 kg exactly, 1 oz = 1/16 lb
    expect(GRAMS_PER_POUND).toBe(453.59237);
    expect(GRAMS_PER_OUNCE).toBe(28.349523125); // computed 453.59237 / 16, exact in binary
    expect(toGrams(1, 'lb')).toBe(453.59237);
    expect(toGrams(16, 'oz')).toBeCloseTo(453.59237, 10);
    expect(fromGrams(453.59237, 'lb')).toBe(1);
  });

  it('converts both ways between g, kg, oz and lb', () => {
    expect(toGrams(2.5, 'kg')).toBe(2500);
    expect(fromGrams(2500, 'kg')).toBe(2.5);
    // computed: 1 kg = 1 / 0.45359237 lb = 2.20462262 lb; = 35.2739619 oz
    expect(fromGrams(1000, 'lb')).toBeCloseTo(2.20462262, 8);
    expect(fromGrams(1000, 'oz')).toBeCloseTo(35.2739619, 7);
    expect(fromGrams(toGrams(3.7, 'oz'), 'oz')).toBeCloseTo(3.7, 12);
  });
});

describe('harvestTotals', () => {
  it('adds weights and counts, per m² and per plant', () => {
    // computed: 1200 + 800 = 2000 g over 2 m² and 10 plants; 10 + 5 pieces
    const t = harvestTotals([{ grams: 1200, count: 10 }, { grams: 800 }, { count: 5 }], { areaM2: 2, plants: 10 });
    expect(t).toEqual({ grams: 2000, count: 15, gramsPerM2: 1000, countPerM2: 7.5, gramsPerPlant: 200, countPerPlant: 1.5 });
  });

  it('leaves the ratios empty without an area or plants, and starts at zero', () => {
    expect(harvestTotals([{ grams: 500 }], { areaM2: 0 })).toMatchObject({ grams: 500, gramsPerM2: null, gramsPerPlant: null });
    expect(harvestTotals([])).toEqual({ grams: 0, count: 0, gramsPerM2: null, countPerM2: null, gramsPerPlant: null, countPerPlant: null });
  });

  it('refuses negative weights and part pieces', () => {
    expect(() => harvestTotals([{ grams: -1 }])).toThrow(RangeError);
    expect(() => harvestTotals([{ count: 1.5 }])).toThrow(RangeError);
    expect(() => harvestTotals([{ grams: Number.NaN }])).toThrow(RangeError);
  });
});

describe('formatWeight', () => {
  it('shows grams, then kilograms from 1000 g', () => {
    expect(formatWeight(850, 'metric')).toBe('850 g');
    expect(formatWeight(999.6, 'metric')).toBe('1 kg');
    expect(formatWeight(1250, 'metric')).toBe('1.25 kg');
    expect(formatWeight(0, 'metric')).toBe('0 g');
  });

  it('shows ounces under a pound, then pounds and whole ounces', () => {
    // computed with 1 oz = 28.349523125 g (NIST Handbook 44 Appendix C)
    expect(formatWeight(28.349523125 * 12.5, 'us')).toBe('12.5 oz');
    expect(formatWeight(453.59237, 'us')).toBe('1 lb');
    expect(formatWeight(1000, 'us')).toBe('2 lb 3 oz'); // 35.27 oz
    expect(formatWeight(28.349523125 * 15.97, 'us')).toBe('1 lb'); // rounds up to 16 oz
    expect(formatWeight(28.349523125 * 31.6, 'us')).toBe('2 lb'); // 31.6 oz → 32 oz
  });
});
