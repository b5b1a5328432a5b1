import { describe, expect, it } from 'vitest';
import { METRES_PER_INCH, squareFeetToSquareMetres } from '../geometry/units';
import {
  CUBIC_INCHES_PER_US_GALLON,
  LITRES_PER_US_GALLON,
  MM_PER_INCH,
  inchesFromMm,
  litresFor,
  litresFromUsGallons,
  mmFromInches,
  usGallonsFor,
  usGallonsFromLitres,
} from './units';

// NIST Handbook 44, Appendix C: 1 inch = 2.54 centimeters and 1 gallon (US) = 231 cubic inches, exactly.
describe('water units (NIST Handbook 44 Appendix C)', () => {
  it('makes 1 US gallon 231 in³ = 3.785411784 L exactly', () => {
    expect(CUBIC_INCHES_PER_US_GALLON).toBe(231);
    // computed: 231 × (0.254 dm)³ = 231 × 0.016387064 dm³ = 3.785411784 L
    expect(CUBIC_INCHES_PER_US_GALLON * (METRES_PER_INCH * 10) ** 3).toBeCloseTo(LITRES_PER_US_GALLON, 12);
    expect(usGallonsFromLitres(LITRES_PER_US_GALLON)).toBe(1);
    expect(litresFromUsGallons(1)).toBe(3.785411784);
  });

  it('gives 1 mm over 1 m² = 1 L (computed: 0.001 m × 1 m² = 1 dm³)', () => {
    expect(litresFor(1, 1)).toBe(1);
    expect(litresFor(15, 3)).toBe(45); // computed: 15 × 3
    expect(litresFor(0, 10)).toBe(0);
  });

  it('gives 1 inch over 1 m² = 25.4 L (computed: 25.4 mm × 1 m²)', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(litresFor(mmFromInches(1), 1)).toBeCloseTo(25.4, 12);
    expect(inchesFromMm(25.4)).toBe(1);
    expect(inchesFromMm(mmFromInches(0.37))).toBeCloseTo(0.37, 12);
  });

  it('gives 1 inch over 200 ft² = 124.68 US gal (computed: 200 × 144 / 231; Purdue Landscape Report rounds to 124)', () => {
    const gal = usGallonsFor(1, 200);
    expect(gal).toBeCloseTo((200 * 144) / 231, 9); // 124.675…
    expect(gal).toBeCloseTo(124.68, 2); // printed to two decimals in the check-value table
    // The same through litres: 25.4 mm over 18.580608 m² (200 ft², NIST) = 471.947… L (computed)
    expect(usGallonsFromLitres(litresFor(25.4, squareFeetToSquareMetres(200)))).toBeCloseTo(gal, 9);
    // computed: 1 in over 1 ft² = 144/231 = 0.623377 gal (Purdue rounds to 0.62)
    expect(usGallonsFor(1, 1)).toBeCloseTo(0.623377, 6);
  });

  it('refuses negative depths or areas and values that are not numbers', () => {
    expect(() => litresFor(-1, 1)).toThrow(RangeError);
    expect(() => litresFor(1, -1)).toThrow(RangeError);
    expect(() => litresFor(Number.NaN, 1)).toThrow(RangeError);
    expect(() => usGallonsFromLitres(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});
