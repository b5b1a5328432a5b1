import { formatMoney } from '@shared/fees/compute';
import type { FeesList } from '@shared/schemas/fees';

/** Four figures for the fees shown: due, paid, refunded and still outstanding. */
export function FeeTotals({ totals, currency }: { totals: FeesList['totals']; currency: string }) {
  const cards = [
    { label: 'Due', value: totals.dueMinor, note: 'Fees and deposits charged' },
    { label: 'Paid', value: totals.paidMinor, note: 'Received so far' },
    { label: 'Refunded', value: totals.refundedMinor, note: 'Deposits handed back' },
    { label: 'Outstanding', value: totals.outstandingMinor, note: 'Still to be paid' },
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 lg:grid-cols-4">
      {cards.map((c) => (
        <div
          key={c.label}
          className={`rounded-xl border bg-white p-4 shadow-sm ${c.label === 'Outstanding' && c.value > 0 ? 'border-clay' : 'border-paper-200'}`}
        >
          <dt className="text-sm font-semibold text-stone">{c.label}</dt>
          <dd className="mt-1 text-xl font-bold tabular-nums sm:text-2xl">{formatMoney(c.value, currency)}</dd>
          <dd className="text-sm text-stone">{c.note}</dd>
        </div>
      ))}
    </dl>
  );
}
