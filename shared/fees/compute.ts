import { squareMetresToSquareFeet } from '../geometry/units';
import type { PlotKind } from '../schemas/plots';
import type { FeeSchedule } from '../schemas/fees';

export interface PlotFee {
  /** The season's fee for the plot, after any concession, in minor units (pence, cents). */
  plotFeeMinor: number;
  /** The refundable deposit, never discounted. */
  depositMinor: number;
  totalMinor: number;
}

const kindPrice: Record<PlotKind, keyof FeeSchedule> = {
  in_ground: 'priceInGroundMinor',
  raised_bed: 'priceRaisedBedMinor',
  container: 'priceContainerMinor',
  shared_bed: 'priceSharedBedMinor',
};

/** Rounds half away from zero to a whole number of minor units. */
function roundMinor(x: number): number {
  // The nudge absorbs binary noise such as 5999.999999999999 for an exact 6000.
  return Math.sign(x) * Math.round(Math.abs(x) + 1e-9);
}

/** A plot's fee for a season from the club's schedule: per area (m² or ft²) or per kind, less any concession. */
export function computePlotFee(
  schedule: FeeSchedule,
  plot: { areaM2: number; kind: PlotKind },
  opts: { concession: boolean },
): PlotFee {
  let base: number;
  if (schedule.basis === 'area') {
    const area = schedule.areaUnit === 'ft2' ? squareMetresToSquareFeet(plot.areaM2) : plot.areaM2;
    base = roundMinor(area * schedule.rateMinorPerArea);
  } else {
    base = schedule[kindPrice[plot.kind]] as number;
  }
  const plotFeeMinor = opts.concession ? roundMinor((base * (100 - schedule.concessionPercent)) / 100) : base;
  return { plotFeeMinor, depositMinor: schedule.depositMinor, totalMinor: plotFeeMinor + schedule.depositMinor };
}

/** Formats minor units as money in the club's currency, e.g. 4500 GBP → "£45.00". */
export function formatMoney(minor: number, currency: string, locale = 'en-GB'): string {
  return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 100);
}

/**
 * Sums payments and deposit refunds against a fee. Refunds are of the deposit only (the server
 * refuses more than the deposit held), so handing a deposit back does not make the fee owed again;
 * a negative balance is money paid beyond what is due.
 */
export function feeBalance(
  fee: { plotFeeMinor: number; depositMinor: number },
  payments: Array<{ kind: 'payment' | 'refund'; amountMinor: number }>,
) {
  const paidMinor = payments.filter((p) => p.kind === 'payment').reduce((s, p) => s + p.amountMinor, 0);
  const refundedMinor = payments.filter((p) => p.kind === 'refund').reduce((s, p) => s + p.amountMinor, 0);
  const depositHeldMinor = Math.max(0, Math.min(paidMinor - fee.plotFeeMinor, fee.depositMinor)) - refundedMinor;
  return {
    paidMinor,
    refundedMinor,
    depositHeldMinor,
    balanceMinor: fee.plotFeeMinor + fee.depositMinor - paidMinor,
  };
}

/**
 * The deposit a new season's fee asks for. A holder keeps one deposit with the club while they
 * hold a plot (common practice for allotment and community garden clubs: the deposit is returned
 * when the plot is given up, not each year), so a deposit already held carries over and only
 * a shortfall (say, after the club raised its deposit) is asked for again.
 */
export function depositDue(scheduleDepositMinor: number, heldMinor: number): number {
  return Math.max(0, scheduleDepositMinor - Math.max(0, heldMinor));
}
