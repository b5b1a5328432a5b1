import { useEffect, useRef, useState, type ReactNode } from 'react';
import { X } from 'lucide-react';
import { formatMoney } from '@shared/fees/compute';
import { paymentMethodLabels, type Fee, type PaymentBody } from '@shared/schemas/fees';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { formatCalendarDate } from '../lib/money-form';
import { BalanceText } from './balance-text';
import { PaymentForm } from './payment-form';

function Figure({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-sm text-stone">{label}</dt>
      <dd className="font-semibold tabular-nums">{children}</dd>
    </div>
  );
}

/** One fee up close (keyed by fee, so opening another starts fresh): what it is, what has come in, and the form to record the next payment. */
export function PaymentPanel({ fee, onClose }: { fee: Fee; onClose: () => void }) {
  const heading = useRef<HTMLHeadingElement>(null);
  const [done, setDone] = useState<string | null>(null);
  const money = (minor: number) => formatMoney(minor, fee.currency);

  useEffect(() => {
    // Opening the panel from a table row moves focus to it, so keyboard users land where they asked to go.
    heading.current?.focus();
    heading.current?.scrollIntoView({ block: 'start', behavior: 'smooth' });
  }, []);

  const onRecorded = (updated: Fee, body: PaymentBody) => {
    const what = body.kind === 'refund' ? 'Refunded' : 'Recorded';
    const left = updated.balanceMinor > 0 ? `${money(updated.balanceMinor)} is still owed.` : 'Nothing more is owed.';
    setDone(`${what} ${money(body.amountMinor)} by ${paymentMethodLabels[body.method].toLowerCase()}. ${left} A receipt is on its way to ${updated.holderEmail}.`);
  };

  return (
    <Card className="scroll-mt-6">
      <div className="mb-4 flex items-start justify-between gap-3">
        <div className="min-w-0">
          <h2 ref={heading} tabIndex={-1} className="text-xl font-semibold focus:outline-none">
            Record payment: {fee.holderName}
          </h2>
          <p className="text-stone">
            {fee.description} · {fee.siteName}
          </p>
          <p className="text-sm break-all text-stone">{fee.holderEmail}</p>
        </div>
        <Button variant="ghost" onClick={onClose} aria-label="Close the payment form">
          <X className="size-5" aria-hidden="true" />
        </Button>
      </div>
      <dl className="mb-5 grid grid-cols-2 gap-3 sm:grid-cols-5">
        <Figure label="Plot fee">{money(fee.plotFeeMinor)}</Figure>
        <Figure label="Deposit">{money(fee.depositMinor)}</Figure>
        <Figure label="Paid">{money(fee.paidMinor)}</Figure>
        <Figure label="Deposit held">{money(fee.depositHeldMinor)}</Figure>
        <Figure label="Balance">
          <BalanceText fee={fee} />
        </Figure>
      </dl>
      {done && (
        <Alert tone="success" className="mb-5">
          {done}
        </Alert>
      )}
      <div className="grid gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <PaymentForm key={fee.id} fee={fee} onRecorded={onRecorded} />
        <div className="min-w-0">
          <h3 className="mb-2 font-semibold">Payments so far</h3>
          {fee.payments.length === 0 ? (
            <p className="text-stone">Nothing recorded yet.</p>
          ) : (
            <ul className="flex flex-col divide-y divide-paper-200">
              {fee.payments.map((p) => (
                <li key={p.id} className="py-2">
                  <span className="font-medium tabular-nums">
                    {p.kind === 'refund' ? `−${money(p.amountMinor)} refund` : money(p.amountMinor)}
                  </span>{' '}
                  <span className="text-stone">
                    {paymentMethodLabels[p.method]}, {formatCalendarDate(p.paidOn)}
                    {p.recordedBy ? `, by ${p.recordedBy}` : ''}
                  </span>
                  {p.note && <span className="block text-sm text-stone">{p.note}</span>}
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </Card>
  );
}
