import { describe, expect, it } from 'vitest';
import { feetToMetres } from '../geometry/units';
import type { FeeSchedule } from '../schemas/fees';
import { computePlotFee, feeBalance, formatMoney } from './compute';

const base: FeeSchedule = {
  basis: 'area',
  areaUnit: 'm2',
  rateMinorPerArea: 250,
  priceInGroundMinor: 4000,
  priceRaisedBedMinor: 2500,
  priceContainerMinor: 800,
  priceSharedBedMinor: 0,
  concessionPercent: 50,
  depositMinor: 1500,
};

// Fee arithmetic is exact integer minor units (computed); the unit conversion is
// NIST SP 811 Appendix B: 1 ft = 0.3048 m exactly, so 1 ft² = 0.09290304 m².
describe('plot fees', () => {
  it('charges per square metre: 3 × 6 m at 2.50 a m² is 45.00, plus the deposit', () => {
    expect(computePlotFee(base, { areaM2: 18, kind: 'in_ground' }, { concession: false })).toEqual({
      plotFeeMinor: 4500,
      depositMinor: 1500,
      totalMinor: 6000,
    });
  });

  it('charges per square foot on the exact conversion: 10 × 20 ft at 30 cents a ft² is 60.00', () => {
    const areaM2 = feetToMetres(10) * feetToMetres(20);
    const fee = computePlotFee({ ...base, areaUnit: 'ft2', rateMinorPerArea: 30 }, { areaM2, kind: 'in_ground' }, { concession: false });
    expect(fee.plotFeeMinor).toBe(6000);
  });

  it('charges per kind of plot when the club prices that way', () => {
    const kind = { ...base, basis: 'kind' as const };
    expect(computePlotFee(kind, { areaM2: 2.88, kind: 'raised_bed' }, { concession: false }).plotFeeMinor).toBe(2500);
    expect(computePlotFee(kind, { areaM2: 1, kind: 'container' }, { concession: false }).plotFeeMinor).toBe(800);
    expect(computePlotFee(kind, { areaM2: 12, kind: 'shared_bed' }, { concession: false }).plotFeeMinor).toBe(0);
  });

  it('takes the concession off the plot fee only, rounding half up to a whole minor unit', () => {
    expect(computePlotFee(base, { areaM2: 18, kind: 'in_ground' }, { concession: true })).toEqual({
      plotFeeMinor: 2250,
      depositMinor: 1500,
      totalMinor: 3750,
    });
    // 4501 × 67 % = 3015.67 → 3016
    const odd = computePlotFee({ ...base, basis: 'kind', priceInGroundMinor: 4501, concessionPercent: 33 }, { areaM2: 18, kind: 'in_ground' }, { concession: true });
    expect(odd.plotFeeMinor).toBe(3016);
    // 25 × 50 % = 12.5 → 13 (half up)
    const half = computePlotFee({ ...base, basis: 'kind', priceContainerMinor: 25 }, { areaM2: 1, kind: 'container' }, { concession: true });
    expect(half.plotFeeMinor).toBe(13);
  });

  it('keeps every result a whole number of minor units', () => {
    for (let a = 0.5; a < 60; a += 0.37) {
      const f = computePlotFee({ ...base, rateMinorPerArea: 233 }, { areaM2: a, kind: 'in_ground' }, { concession: true });
      expect(Number.isInteger(f.plotFeeMinor)).toBe(true);
      expect(Number.isInteger(f.totalMinor)).toBe(true);
    }
  });

  it('balances payments and refunds', () => {
    const fee = { plotFeeMinor: 4500, depositMinor: 1500 };
    expect(feeBalance(fee, [])).toEqual({ paidMinor: 0, refundedMinor: 0, depositHeldMinor: 0, balanceMinor: 6000 });
    // A partial payment covers the plot fee first; the deposit is held once paid.
    expect(feeBalance(fee, [{ kind: 'payment', amountMinor: 5000 }])).toMatchObject({ depositHeldMinor: 500, balanceMinor: 1000 });
    expect(feeBalance(fee, [{ kind: 'payment', amountMinor: 2000 }, { kind: 'payment', amountMinor: 4000 }])).toEqual({
      paidMinor: 6000,
      refundedMinor: 0,
      depositHeldMinor: 1500,
      balanceMinor: 0,
    });
    // The deposit handed back at the end of the season: the fee stays settled, nothing is held.
    expect(feeBalance(fee, [{ kind: 'payment', amountMinor: 6000 }, { kind: 'refund', amountMinor: 1500 }])).toEqual({
      paidMinor: 6000,
      refundedMinor: 1500,
      depositHeldMinor: 0,
      balanceMinor: 0,
    });
  });

  it('formats minor units in the club currency', () => {
    expect(formatMoney(4500, 'GBP')).toBe('£45.00');
    expect(formatMoney(123456, 'USD', 'en-US')).toBe('$1,234.56');
  });
});
