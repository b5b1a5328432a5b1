import { useEffect, useRef } from 'react';
import type { Season } from '@shared/schemas/seasons';
import { LocalDate } from '@/lib/time-zone';
import { useLeftOut } from '../api/get-left-out';
import { plural } from '@/lib/format';


/**
 * How the season was opened, from the server, so it still reads the same after a reload: when,
 * by whom, how many renewals went and how many holders were left out. Takes focus when `justOpened`.
 */
function SeasonOpened({ season, justOpened }: { season: Season; justOpened: boolean }) {
  const c = season.counts;
  const leftOut = useLeftOut(season.id);
  const ref = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    // After the confirm dialog has closed and handed focus back, so this is where focus ends up.
    if (justOpened) requestAnimationFrame(() => ref.current?.focus());
  }, [justOpened]);
  const renewals = c.renewalsPending + c.renewalsKept + c.renewalsReleased + c.renewalsLapsed;
  const left = leftOut.data?.items.length ?? 0;
  return (
    <p ref={ref} tabIndex={-1} role="status" className="rounded-lg border-l-4 border-leaf bg-leaf-50 p-3 text-leaf-800 outline-none focus-visible:ring-2 focus-visible:ring-leaf">
      The {season.year} season was opened on <LocalDate value={season.createdAt} />
      {season.openedBy ? ` by ${season.openedBy}` : ''}
      {renewals > 0 || left > 0 ? `: ${plural(renewals, 'renewal e-mail', 'renewal e-mails')} sent` : ''}
      {left > 0 && (
        <>
          ; {plural(left, 'holder', 'holders')} left out (<a href="#left-out" className="font-medium underline">see why</a>)
        </>
      )}
      .
    </p>
  );
}

/** The season's renewals and offers at a glance. */
export function SeasonSummary({ season, justOpened = false }: { season: Season; justOpened?: boolean }) {
  const c = season.counts;
  const items: Array<[string, number, string | null]> = [
    ['Renewals waiting for an answer', c.renewalsPending, season.renewalDeadline],
    ['Plots kept', c.renewalsKept, null],
    ['Plots given up', c.renewalsReleased, null],
    ['Renewals not answered in time', c.renewalsLapsed, null],
    ['Offers open', c.offersPending, null],
    ['Plots taken', c.taken, null],
  ];
  return (
    <div className="space-y-3">
      <SeasonOpened season={season} justOpened={justOpened} />
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
        {items.map(([label, n, until]) => (
          <div key={label} className="rounded-xl border border-paper-300 bg-white p-3">
            <dt className="text-sm text-stone">{label}</dt>
            <dd className="text-2xl font-bold tabular-nums">{n}</dd>
            {until && (
              <dd className="text-xs text-stone">
                until <LocalDate value={until} />
              </dd>
            )}
          </div>
        ))}
      </dl>
    </div>
  );
}
