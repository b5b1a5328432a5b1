import { z } from 'zod';
import { dateWithinSchema, textSchema } from './common';

/**
 * The most a club may charge per m² or ft². The largest plot (200 × 200 m, about 430,556 ft²) at this
 * rate still costs less than an integer column holds (2^31 − 1 minor units), so a fee is always stored.
 */
export const MAX_RATE_MINOR_PER_AREA = 4_000;

const minor = z.number().int('Whole minor units (pence, cents)').min(0, 'Cannot be negative').max(100_000_000);

/** How a club charges for plots: per area or per kind of plot, with a concession and a deposit. */
export const FeeScheduleSchema = z.strictObject({
  basis: z.enum(['area', 'kind']),
  areaUnit: z.enum(['m2', 'ft2']),
  rateMinorPerArea: minor.max(MAX_RATE_MINOR_PER_AREA, `At most ${MAX_RATE_MINOR_PER_AREA} minor units per area unit`),
  priceInGroundMinor: minor,
  priceRaisedBedMinor: minor,
  priceContainerMinor: minor,
  priceSharedBedMinor: minor,
  concessionPercent: z.number().int().min(0, '0 to 100').max(100, '0 to 100'),
  depositMinor: minor,
});
export type FeeSchedule = z.infer<typeof FeeScheduleSchema>;

export const paymentMethods = ['cash', 'cheque', 'bank_transfer', 'card'] as const;
export const paymentMethodLabels: Record<(typeof paymentMethods)[number], string> = {
  cash: 'Cash',
  cheque: 'Cheque',
  bank_transfer: 'Bank transfer',
  card: 'Card',
};

export const PaymentBodySchema = z.strictObject({
  kind: z.enum(['payment', 'refund']).default('payment'),
  amountMinor: z.number().int('Whole minor units (pence, cents)').positive('Must be more than 0').max(100_000_000),
  method: z.enum(paymentMethods),
  paidOn: dateWithinSchema({
    earliest: '2000-01-01',
    daysAhead: 366,
    message: 'A date like 2027-03-14',
    tooLateMessage: 'At most a year from today',
  }),
  note: textSchema({ max: 300 }).default(''),
});
export type PaymentBody = z.infer<typeof PaymentBodySchema>;

export const PaymentSchema = z.object({
  id: z.number().int(),
  kind: z.enum(['payment', 'refund']),
  amountMinor: z.number().int(),
  method: z.enum(paymentMethods),
  paidOn: z.string(),
  note: z.string(),
  recordedBy: z.string().nullable(),
});

/** A fee with what has been paid and what is still owed. */
export const FeeSchema = z.object({
  id: z.number().int(),
  seasonYear: z.number().int(),
  userId: z.number().int(),
  holderName: z.string(),
  holderEmail: z.string(),
  plotId: z.number().int(),
  plotLabel: z.string(),
  siteName: z.string(),
  description: z.string(),
  plotFeeMinor: z.number().int(),
  depositMinor: z.number().int(),
  isConcession: z.boolean(),
  currency: z.string(),
  dueOn: z.string(),
  paidMinor: z.number().int(),
  refundedMinor: z.number().int(),
  depositHeldMinor: z.number().int(),
  balanceMinor: z.number().int(),
  payments: z.array(PaymentSchema),
});
export type Fee = z.infer<typeof FeeSchema>;

export const FeesListSchema = z.object({
  items: z.array(FeeSchema),
  page: z.number().int(),
  total: z.number().int(),
  totals: z.object({ dueMinor: z.number().int(), paidMinor: z.number().int(), refundedMinor: z.number().int(), outstandingMinor: z.number().int() }),
});
export type Payment = z.infer<typeof PaymentSchema>;
export type FeesList = z.infer<typeof FeesListSchema>;

export const feeStatusFilters = ['unpaid', 'paid', 'all'] as const;

/** GET /api/clubs/:clubId/fees and fees.csv: one season's fees (every season when year is left out). */
export const FeesQuerySchema = z.strictObject({
  // An empty `year=` means every season, as a form's blank option sends it.
  year: z.preprocess(
    (v) => (v === '' ? undefined : v),
    z.coerce.number().int('A year like 2027').min(2000, 'A year like 2027').max(2100, 'A year like 2027').optional(),
  ),
  status: z.enum(feeStatusFilters).default('all'),
});
export type FeesQuery = z.infer<typeof FeesQuerySchema>;

/** One of the signed-in person's own fees, with the club it belongs to. */
export const MyFeeSchema = FeeSchema.extend({ clubId: z.number().int(), clubName: z.string() });
export type MyFee = z.infer<typeof MyFeeSchema>;

/** GET /api/me/fees: the signed-in person's fees in every club, unpaid first. */
export const MyFeesListSchema = z.object({ items: z.array(MyFeeSchema), page: z.number().int(), total: z.number().int() });
