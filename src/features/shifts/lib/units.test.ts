import { describe, expect, it } from 'vitest';
import { waterText } from './units';

describe('water on a shift, in the site’s units', () => {
  it('shows litres on metric sites', () => {
    expect(waterText(45.4, 'metric')).toBe('45 litres');
    expect(waterText(1, 'metric')).toBe('1 litre');
    expect(waterText(2.25, 'metric')).toBe('2.3 litres');
  });

  it('shows US gallons on US sites (1 US gallon = 3.785411784 L, NIST Handbook 44, Appendix C)', () => {
    // computed: 45 L ÷ 3.785411784 = 11.887… US gal → 12 (whole from 10)
    expect(waterText(45, 'us')).toBe('12 US gallons');
    // computed: 20 L ÷ 3.785411784 = 5.283… US gal → 5.3
    expect(waterText(20, 'us')).toBe('5.3 US gallons');
    expect(waterText(3.785411784, 'us')).toBe('1 US gallon');
  });

  it('says nothing when the shift waters nothing', () => {
    expect(waterText(null, 'metric')).toBeNull();
    expect(waterText(null, 'us')).toBeNull();
  });
});
