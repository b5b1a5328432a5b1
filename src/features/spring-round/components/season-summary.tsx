import type { Season } from '@shared/schemas/seasons';
import { formatDate } from '@/lib/format';
import { useTimeZone } from '@/lib/time-zone';

/** The season's renewals and offers at a glance. */
export function SeasonSummary({ season }: { season: Season }) {
  const c = season.counts;
  const zone = useTimeZone();
  const items: Array<[string, number, string]> = [
    ['Renewals waiting for an answer', c.renewalsPending, season.renewalDeadline ? `until ${formatDate(season.renewalDeadline, zone)}` : ''],
    ['Plots kept', c.renewalsKept, ''],
    ['Plots given up', c.renewalsReleased, ''],
    ['Renewals not answered in time', c.renewalsLapsed, ''],
    ['Offers open', c.offersPending, ''],
    ['Plots taken', c.taken, ''],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
      {items.map(([label, n, note]) => (
        <div key={label} className="rounded-xl border border-paper-300 bg-white p-3">
          <dt className="text-sm text-stone">{label}</dt>
          <dd className="text-2xl font-bold tabular-nums">{n}</dd>
          {note && <dd className="text-xs text-stone">{note}</dd>}
        </div>
      ))}
    </dl>
  );
}
