import { z } from 'zod';
import { formatMoney } from '@shared/fees/compute';
import { minorToDecimal } from '@shared/fees/money';
import { PaymentBodySchema, paymentMethods, type Fee, type PaymentBody } from '@shared/schemas/fees';
import { moneyText, todayIso } from './money-form';

/** What the payment inputs hold: the amount as decimal text in the fee's currency. */
export interface PaymentFormValues {
  kind: PaymentBody['kind'];
  amount: string;
  method: PaymentBody['method'];
  paidOn: string;
  note: string;
}

export const paymentFieldNames = ['kind', 'amount', 'method', 'paidOn', 'note'] as const satisfies readonly (keyof PaymentFormValues)[];

/** The amount a coordinator most often records: what is owed, or for a refund the deposit held. */
export function suggestedAmount(fee: Fee, kind: PaymentBody['kind']): string {
  const minor = kind === 'refund' ? fee.depositHeldMinor : Math.max(0, fee.balanceMinor);
  return minor > 0 ? minorToDecimal(minor) : '';
}

/** Fresh inputs for a fee: today's date in the club's zone, cash, and the amount still owed. */
export function emptyPayment(fee: Fee, timeZone: string): PaymentFormValues {
  return { kind: 'payment', amount: suggestedAmount(fee, 'payment'), method: 'cash', paidOn: todayIso(timeZone), note: '' };
}

/**
 * Reads the inputs into a payment body, with the same limits the server applies (no more than is owed,
 * refunds only of the deposit held) so the coordinator hears about a slip before anything is sent.
 */
export function paymentFormSchema(fee: Fee) {
  const shape = PaymentBodySchema.shape;
  const money = (minor: number) => formatMoney(minor, fee.currency);
  return z
    .object({
      kind: z.enum(['payment', 'refund']),
      amount: moneyText.pipe(shape.amountMinor),
      method: z.enum(paymentMethods),
      paidOn: z.iso.date('Pick the date it was paid'),
      note: z.string().trim().max(300, 'At most 300 characters'),
    })
    .superRefine((v, ctx) => {
      if (v.kind === 'payment' && v.amount > fee.balanceMinor) {
        ctx.addIssue({
          code: 'custom',
          path: ['amount'],
          message: fee.balanceMinor > 0 ? `At most ${money(fee.balanceMinor)}, what is still owed` : 'This fee is fully paid',
        });
      }
      if (v.kind === 'refund' && v.amount > fee.depositHeldMinor) {
        ctx.addIssue({
          code: 'custom',
          path: ['amount'],
          message: fee.depositHeldMinor > 0 ? `At most ${money(fee.depositHeldMinor)}, the deposit held` : 'No deposit is held for this fee',
        });
      }
    })
    .transform((v): PaymentBody => ({ kind: v.kind, amountMinor: v.amount, method: v.method, paidOn: v.paidOn, note: v.note }));
}
