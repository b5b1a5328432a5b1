import { formatDate } from '@shared/dates';
import { formatMoney } from '@shared/fees/compute';
import { paymentMethodLabels, type PaymentBody } from '@shared/schemas/fees';
import { renderMail } from './templates';


/** The receipt a plot holder gets when the coordinator records a payment or hands a deposit back. */
export function paymentReceiptMail(p: {
  to: string;
  name: string;
  clubName: string;
  description: string;
  currency: string;
  payment: Pick<PaymentBody, 'kind' | 'amountMinor' | 'method' | 'paidOn'>;
  balanceMinor: number;
  depositHeldMinor: number;
}) {
  const money = (minor: number) => formatMoney(minor, p.currency);
  const amount = money(p.payment.amountMinor);
  const method = paymentMethodLabels[p.payment.method].toLowerCase();
  // A calendar date shows as that day in every zone.
  const date = formatDate(p.payment.paidOn, 'UTC');
  const refund = p.payment.kind === 'refund';
  const owed =
    p.balanceMinor > 0
      ? `Still to pay: ${money(p.balanceMinor)}.`
      : p.balanceMinor < 0
        ? `You have paid ${money(-p.balanceMinor)} more than was due; the coordinator will sort it out with you.`
        : 'Nothing more is owed for this plot.';
  return renderMail({
    to: p.to,
    subject: refund ? `Deposit refunded: ${amount} (${p.clubName})` : `Receipt: ${amount} paid to ${p.clubName}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      refund
        ? `${p.clubName} has refunded ${amount} of your deposit for ${p.description}, by ${method} on ${date}.`
        : `${p.clubName} has received ${amount} from you for ${p.description}, by ${method} on ${date}.`,
      owed,
      ...(p.depositHeldMinor > 0 ? [`The club now holds ${money(p.depositHeldMinor)} as your deposit.`] : []),
      'Keep this e-mail as your receipt. If anything here looks wrong, tell your coordinator.',
    ],
    why: `You got this because a coordinator of ${p.clubName} recorded a payment against your plot fee on Tillwell.`,
  });
}
