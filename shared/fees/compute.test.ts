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

  // The rule (compute.ts, roundMinor): each step rounds half away from zero to a whole minor
  // unit: first area × rate, then the concession on that whole base; the deposit is never discounted.
  it('keeps every result a whole number of minor units, rounding each step half away from zero', () => {
    const area = (areaM2: number, rateMinorPerArea: number, concessionPercent = 50, concession = false) =>
      computePlotFee({ ...base, rateMinorPerArea, concessionPercent }, { areaM2, kind: 'in_ground' }, { concession });
    const kind = (priceInGroundMinor: number, concessionPercent: number) =>
      computePlotFee({ ...base, basis: 'kind', priceInGroundMinor, concessionPercent }, { areaM2: 18, kind: 'in_ground' }, { concession: true });

    // Thirds. computed: 10/3 m² × 250 = 2500/3 = 833.33… → 833 (down); total 833 + 1500 = 2333
    expect(area(10 / 3, 250)).toEqual({ plotFeeMinor: 833, depositMinor: 1500, totalMinor: 2333 });
    // computed: 20/3 m² × 250 = 5000/3 = 1666.66… → 1667 (up)
    expect(area(20 / 3, 250).plotFeeMinor).toBe(1667);

    // A 33 % concession leaves 67 %. computed: 1000 × 0.67 = 670 (exact); deposit stays 1500, total 2170
    expect(kind(1000, 33)).toEqual({ plotFeeMinor: 670, depositMinor: 1500, totalMinor: 2170 });
    // On the whole thirds base: computed: 833 × 0.67 = 558.11 → 558; 1667 × 0.67 = 1116.89 → 1117
    expect(area(10 / 3, 250, 33, true).plotFeeMinor).toBe(558);
    expect(area(20 / 3, 250, 33, true).plotFeeMinor).toBe(1117);

    // Half-way cases go away from zero, so the odd unit is charged, never dropped.
    // computed: 4501 × 0.50 = 2250.5 → 2251 (half-to-even would give 2250); total 2251 + 1500 = 3751
    expect(kind(4501, 50)).toEqual({ plotFeeMinor: 2251, depositMinor: 1500, totalMinor: 3751 });
    // computed: 50 × 0.67 = 33.5 → 34
    expect(kind(50, 33).plotFeeMinor).toBe(34);
    // computed: 1.13 m² × 150 = 169.5 → 170 (in binary 1.13 × 150 is 169.49999999999997,
    // which a plain Math.round would take down to 169)
    expect(area(1.13, 150).plotFeeMinor).toBe(170);

    // Where the odd unit goes across the two steps: the base is rounded before the concession.
    // computed: 4.0024 m² × 250 = 1000.6 → 1001; 1001 × 0.50 = 500.5 → 501
    // (a single rounding at the end would give 1000.6 × 0.50 = 500.3 → 500)
    expect(area(4.0024, 250, 50, false).plotFeeMinor).toBe(1001);
    expect(area(4.0024, 250, 50, true)).toEqual({ plotFeeMinor: 501, depositMinor: 1500, totalMinor: 2001 });
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
