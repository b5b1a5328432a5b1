import { formatDate } from '@shared/dates';
import { formatMoney } from '@shared/fees/compute';
import { paymentMethodLabels, type PaymentBody } from '@shared/schemas/fees';
import { MailLayout, P, renderMail } from './layout';

interface PaymentReceiptProps {
  to: string;
  name: string;
  clubName: string;
  description: string;
  currency: string;
  payment: Pick<PaymentBody, 'kind' | 'amountMinor' | 'method' | 'paidOn'>;
  balanceMinor: number;
  depositHeldMinor: number;
}

export function PaymentReceiptEmail(p: PaymentReceiptProps) {
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
  return (
    <MailLayout
      preview={refund ? `${amount} of your deposit refunded` : `${amount} received`}
      greeting={`Hello ${p.name},`}
      why={`You got this because a coordinator of ${p.clubName} recorded a payment against your plot fee on Tillwell.`}
    >
      <P>
        {refund
          ? `${p.clubName} has refunded ${amount} of your deposit for ${p.description}, by ${method} on ${date}.`
          : `${p.clubName} has received ${amount} from you for ${p.description}, by ${method} on ${date}.`}
      </P>
      <P>{owed}</P>
      {p.depositHeldMinor > 0 ? <P>{`The club now holds ${money(p.depositHeldMinor)} as your deposit.`}</P> : null}
      <P>Keep this e-mail as your receipt. If anything here looks wrong, tell your coordinator.</P>
    </MailLayout>
  );
}

/** The receipt a plot holder gets when the coordinator records a payment or hands a deposit back. */
export function paymentReceiptMail(p: PaymentReceiptProps) {
  const amount = formatMoney(p.payment.amountMinor, p.currency);
  const subject = p.payment.kind === 'refund' ? `Deposit refunded: ${amount} (${p.clubName})` : `Receipt: ${amount} paid to ${p.clubName}`;
  return renderMail(p.to, subject, <PaymentReceiptEmail {...p} />);
}
