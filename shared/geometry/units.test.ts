import { describe, expect, it } from 'vitest';
import {
  FEET_PER_METRE,
  METRES_PER_FOOT,
  METRES_PER_INCH,
  INCHES_PER_FOOT,
  SQUARE_METRES_PER_SQUARE_FOOT,
  feetToMetres,
  formatArea,
  formatLength,
  fromDisplayLength,
  metresToFeet,
  roundTo,
  squareFeetToSquareMetres,
  squareMetresToSquareFeet,
  toDisplayArea,
  toDisplayLength,
} from './units';

// Published values: NIST SP 811 (2008 edition), Appendix B — foot = 3.048 E-01 m,
// inch = 2.54 E-02 m, square foot = 9.290 304 E-02 m², all exact; NIST
// Handbook 44, Appendix C — 1 foot = 0.3048 meter and 1 inch = 2.54 centimeters, exactly.
describe('unit constants', () => {
  it('uses the exact international foot and inch', () => {
    expect(METRES_PER_FOOT).toBe(0.3048);
    expect(feetToMetres(1)).toBe(0.3048);
    expect(metresToFeet(0.3048)).toBe(1);
    expect(METRES_PER_INCH * 1000).toBeCloseTo(25.4, 12);
    expect(METRES_PER_INCH * INCHES_PER_FOOT).toBeCloseTo(METRES_PER_FOOT, 15);
  });

  it('derives the square foot from the foot', () => {
    expect(SQUARE_METRES_PER_SQUARE_FOOT).toBeCloseTo(METRES_PER_FOOT * METRES_PER_FOOT, 15);
  });

  it('gives 1 m = 3.280839895 ft (1 / 0.3048, NIST SP 811 Appendix B)', () => {
    expect(metresToFeet(1)).toBeCloseTo(3.280839895, 9);
    expect(FEET_PER_METRE).toBeCloseTo(3.280839895, 9);
  });
});

describe('area conversion', () => {
  it('gives a 10 ft × 20 ft plot 200 ft² = 18.580608 m² (200 × 0.09290304, NIST SP 811 Appendix B)', () => {
    const m2 = feetToMetres(10) * feetToMetres(20);
    expect(m2).toBeCloseTo(200 * 0.09290304, 12);
    expect(m2).toBeCloseTo(18.580608, 12);
    expect(squareFeetToSquareMetres(200)).toBeCloseTo(18.580608, 12);
    expect(squareMetresToSquareFeet(m2)).toBeCloseTo(200, 10);
  });
});

describe('round trips', () => {
  const lengths = [0, 0.1, 0.3048, 1, 2.5, 3.048, 12.7, 100, 1234.5678];
  it.each(lengths)('metres → feet → metres keeps %d m', (m) => {
    expect(feetToMetres(metresToFeet(m))).toBeCloseTo(m, 12);
  });
  it.each(lengths)('feet → metres → feet keeps %d ft', (ft) => {
    expect(metresToFeet(feetToMetres(ft))).toBeCloseTo(ft, 12);
  });
  it.each(lengths)('m² → ft² → m² keeps %d m²', (m2) => {
    expect(squareFeetToSquareMetres(squareMetresToSquareFeet(m2))).toBeCloseTo(m2, 12);
  });
  it('display lengths round-trip in both systems', () => {
    for (const m of lengths) {
      expect(fromDisplayLength(toDisplayLength(m, 'metric'), 'metric')).toBe(m);
      expect(fromDisplayLength(toDisplayLength(m, 'us'), 'us')).toBeCloseTo(m, 12);
    }
  });
});

describe('display values', () => {
  it('shows metric as stored and US customary in feet', () => {
    expect(toDisplayLength(3, 'metric')).toBe(3);
    expect(toDisplayLength(3.048, 'us')).toBeCloseTo(10, 12);
    expect(fromDisplayLength(10, 'us')).toBeCloseTo(3.048, 12);
    expect(toDisplayArea(18, 'metric')).toBe(18);
    expect(toDisplayArea(18.580608, 'us')).toBeCloseTo(200, 10);
  });
});

describe('roundTo', () => {
  it('rounds the decimal a person sees, not the binary approximation', () => {
    expect(roundTo(1.005)).toBe(1.01);
    expect(roundTo(2.675)).toBe(2.68);
    expect(roundTo(-1.005)).toBe(-1.01);
    expect(roundTo(0.1 + 0.2)).toBe(0.3);
    expect(roundTo(1.234, 1)).toBe(1.2);
  });
  it('never gives negative zero', () => {
    expect(Object.is(roundTo(-0.001), 0)).toBe(true);
  });
});

describe('formatLength / formatArea', () => {
  it('formats with the unit and trims trailing zeros', () => {
    expect(formatLength(3, 'metric')).toBe('3 m');
    expect(formatLength(2.5, 'metric')).toBe('2.5 m');
    expect(formatLength(0.3333, 'metric')).toBe('0.33 m');
    expect(formatLength(3.048, 'us')).toBe('10 ft');
    expect(formatLength(1, 'us')).toBe('3.28 ft');
    expect(formatLength(0.9, 'us')).toBe('2.95 ft');
  });
  it('formats areas with squared units', () => {
    expect(formatArea(18, 'metric')).toBe('18 m²');
    expect(formatArea(feetToMetres(10) * feetToMetres(20), 'us')).toBe('200 ft²');
    expect(formatArea(feetToMetres(10) * feetToMetres(20), 'metric')).toBe('18.58 m²');
    expect(formatArea(1, 'us')).toBe('10.76 ft²');
  });
  it('allows fewer decimals when asked', () => {
    expect(formatLength(1, 'us', 0)).toBe('3 ft');
    expect(formatArea(18.580608, 'metric', 1)).toBe('18.6 m²');
  });
});
