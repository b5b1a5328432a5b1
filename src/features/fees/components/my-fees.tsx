import { formatMoney } from '@shared/fees/compute';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { LoadingState } from '@/components/ui/spinner';
import { useMyFees } from '../api/get-my-fees';
import { formatCalendarDate } from '../lib/calendar-date';

/** A plot holder's own fees in one club, owed ones first: shown on the club home. */
export function MyFees({ clubId }: { clubId: number }) {
  const mine = useMyFees();
  const fees = mine.data?.items.filter((f) => f.clubId === clubId) ?? [];
  return (
    <section aria-labelledby="your-fees" className="mt-10">
      <h2 id="your-fees" className="mb-4 text-xl font-semibold">
        Your fees
      </h2>
      {mine.isPending ? (
        <LoadingState inline label="Loading your fees…" />
      ) : mine.isError ? (
        <Alert tone="error">Your fees didn't load. {mine.error.message}</Alert>
      ) : fees.length === 0 ? (
        <p className="text-stone">Nothing to pay: you have no plot fees in this club yet.</p>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2">
          {fees.map((f) => {
            const money = (minor: number) => formatMoney(minor, f.currency);
            return (
              <li key={f.id} className="rounded-xl border border-paper-200 bg-white p-5 shadow-sm">
                <div className="flex items-start justify-between gap-3">
                  <h3 className="font-semibold">{f.description}</h3>
                  {f.balanceMinor > 0 ? <Badge tone="straw">To pay</Badge> : <Badge tone="leaf">Paid</Badge>}
                </div>
                <p className="text-sm text-stone">{f.siteName}</p>
                <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 tabular-nums">
                  <dt className="text-stone">Plot fee{f.isConcession ? ' (concession)' : ''}</dt>
                  <dd className="text-right">{money(f.plotFeeMinor)}</dd>
                  <dt className="text-stone">Deposit</dt>
                  <dd className="text-right">{money(f.depositMinor)}</dd>
                  <dt className="text-stone">Paid</dt>
                  <dd className="text-right">{money(f.paidMinor)}</dd>
                  <dt className="font-semibold">Still to pay</dt>
                  <dd className="text-right font-semibold">{money(Math.max(0, f.balanceMinor))}</dd>
                </dl>
                {f.balanceMinor > 0 && (
                  <p className="mt-3 text-sm text-stone">
                    Due by {formatCalendarDate(f.dueOn)}. Pay your coordinator; you get a receipt by e-mail.
                  </p>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
