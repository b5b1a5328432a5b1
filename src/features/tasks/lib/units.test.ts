import { describe, expect, it } from 'vitest';
import {
  formatDepth,
  formatVolume,
  formatWaterAmount,
  LITRES_PER_US_GALLON,
  litresToUsGallons,
  MM_PER_INCH,
  mmToInches,
} from './units';

describe('water units (NIST Handbook 44, Appendix C)', () => {
  it('uses the exact definitions: 1 in = 25.4 mm and 1 US gallon = 3.785411784 L', () => {
    // NIST Handbook 44, Appendix C: 1 inch = 2.54 centimetres exactly; 1 gallon (US) = 231 in³ = 3.785 411 784 litres exactly.
    expect(MM_PER_INCH).toBe(25.4);
    expect(LITRES_PER_US_GALLON).toBe(3.785411784);
    // computed: 231 in³ × (2.54 cm)³ = 231 × 16.387064 cm³ = 3785.411784 cm³ = 3.785411784 L
    expect(231 * 2.54 ** 3 / 1000).toBeCloseTo(LITRES_PER_US_GALLON, 12);
  });

  it('converts depth and volume both ways round exactly where the definitions are exact', () => {
    expect(mmToInches(25.4)).toBe(1);
    // computed: 254 mm ÷ 25.4 = 10 in
    expect(mmToInches(254)).toBeCloseTo(10, 12);
    expect(litresToUsGallons(3.785411784)).toBe(1);
    // computed: 37.85411784 L ÷ 3.785411784 = 10 US gal
    expect(litresToUsGallons(37.85411784)).toBeCloseTo(10, 12);
  });

  it('shows depth in mm on metric sites and inches on US sites', () => {
    expect(formatDepth(25, 'metric')).toBe('25 mm');
    expect(formatDepth(4.46, 'metric')).toBe('4.5 mm');
    // computed: 25 mm ÷ 25.4 = 0.98425… in → 0.98 in
    expect(formatDepth(25, 'us')).toBe('0.98 in');
    // computed: 12 mm ÷ 25.4 = 0.4724… in → 0.47 in
    expect(formatDepth(12, 'us')).toBe('0.47 in');
  });

  it('shows volume in litres on metric sites and US gallons on US sites', () => {
    expect(formatVolume(45.4, 'metric')).toBe('45 litres');
    expect(formatVolume(1, 'metric')).toBe('1 litre');
    // computed: 45 L ÷ 3.785411784 = 11.887… US gal → 12 (whole from 10)
    expect(formatVolume(45, 'us')).toBe('12 US gallons');
    // computed: 20 L ÷ 3.785411784 = 5.283… US gal → 5.3
    expect(formatVolume(20, 'us')).toBe('5.3 US gallons');
    expect(formatVolume(3.785411784, 'us')).toBe('1 US gallon');
  });

  it('joins a water task amount, or says nothing when there is none', () => {
    expect(formatWaterAmount(12, 45, 'metric')).toBe('12 mm, 45 litres');
    expect(formatWaterAmount(12, null, 'us')).toBe('0.47 in');
    expect(formatWaterAmount(null, null, 'metric')).toBeNull();
  });
});
