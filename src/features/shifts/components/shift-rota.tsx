import { Link, useSearchParams } from 'react-router-dom';
import { ArrowLeft, Printer } from 'lucide-react';
import { localToday } from '@shared/dates';
import type { Shift } from '@shared/schemas/shifts';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { formatDate } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useShifts } from '../api/get-shifts';
import { readBoardParams, writeBoardParams } from '../lib/board-params';
import { dayHeading, groupByDay, rangeLabel, shiftTimes, weekOf } from '../lib/dates';
import { kindWords, placesText } from '../lib/words';

export interface ShiftRotaProps {
  clubId: number;
  clubName: string;
  /** The club's zone: which week is "this week", and the printed date. */
  timeZone: string;
  sites: Array<{ id: number; name: string }>;
  isCoordinator: boolean;
}

/** How many places of a shift still want a name written in: open places of a shift that still needs people. */
export function openPlaces(s: Pick<Shift, 'state' | 'capacity' | 'taken'>): number {
  return s.state === 'needs_people' ? Math.max(0, s.capacity - s.taken) : 0;
}

function Names({ shift: s, isCoordinator }: { shift: Shift; isCoordinator: boolean }) {
  if (s.state === 'called_off') return <span className="font-semibold">Called off</span>;
  const names = isCoordinator ? (s.people ?? []).filter((p) => p.status === 'taken' || p.status === 'done').map((p) => p.name) : [];
  const blanks = openPlaces(s);
  return (
    <ul className="flex flex-col gap-1">
      {names.map((n, i) => (
        <li key={`${n}-${i}`} className="rota-name">
          {n}
        </li>
      ))}
      {!isCoordinator && s.taken > 0 && <li className="text-stone">{s.taken === 1 ? '1 place taken' : `${s.taken} places taken`}</li>}
      {Array.from({ length: blanks }, (_, i) => (
        <li key={`blank-${i}`} className="rota-blank h-7 w-full min-w-40 border-b border-soil">
          <span className="sr-only">Open place, write a name here</span>
        </li>
      ))}
    </ul>
  );
}

/**
 * `/clubs/:clubId/shifts/print?date=&site=&kind=&open=`: one week's shifts by day for the noticeboard,
 * times on each site's clock, with a blank line for each place still open (names for coordinators).
 */
export function ShiftRota({ clubId, clubName, timeZone, sites, isCoordinator }: ShiftRotaProps) {
  const [searchParams] = useSearchParams();
  const today = localToday(timeZone);
  const params = readBoardParams(searchParams, { today, siteIds: sites.map((s) => s.id) });
  const week = weekOf(params.date);
  const shifts = useShifts({ clubId, from: week.from, to: week.to, siteId: params.siteId, kind: params.kind, open: params.open || undefined });
  const boardQuery = writeBoardParams(params, {}, { today }).toString();
  const siteName = sites.find((s) => s.id === params.siteId)?.name;

  let body;
  if (shifts.isPending || shifts.isPlaceholderData) body = <LoadingState label={`Loading ${rangeLabel(week.from, week.to)}…`} />;
  else if (shifts.isError) {
    body = (
      <ErrorState
        title="The shifts didn't load"
        message={shifts.error.message}
        requestId={isApiError(shifts.error) ? shifts.error.requestId : undefined}
        onRetry={() => void shifts.refetch()}
        retrying={shifts.isFetching}
      />
    );
  } else {
    const groups = groupByDay(shifts.data.items, week.days).filter((g) => g.items.length > 0);
    body =
      groups.length === 0 ? (
        <p className="rounded-lg border border-dashed border-paper-300 px-4 py-3 text-stone">No shifts this week.</p>
      ) : (
        <div className="flex flex-col gap-4">
          {groups.map((g) => (
            <section key={g.date} aria-labelledby={`rota-${g.date}`} className="rota-day">
              <h2 id={`rota-${g.date}`} className="mb-1 text-lg font-semibold">
                {dayHeading(g.date)}
              </h2>
              {/* On a phone the sheet's table scrolls in its own box; the page itself stays the screen's width. */}
              <div className="overflow-x-auto" tabIndex={0} role="region" aria-labelledby={`rota-${g.date}`}>
                <table className="w-full border-collapse text-left text-sm">
                <thead>
                  <tr className="border-b-2 border-soil">
                    <th scope="col" className="w-44 py-1 pr-3">Time</th>
                    <th scope="col" className="w-40 py-1 pr-3">Site</th>
                    <th scope="col" className="py-1 pr-3">Shift</th>
                    <th scope="col" className="w-28 py-1 pr-3">Places</th>
                    <th scope="col" className="w-64 py-1">{isCoordinator ? 'Names' : 'Write your name'}</th>
                  </tr>
                </thead>
                <tbody>
                  {g.items.map((s) => (
                    <tr key={s.id} data-shift={s.id} className="border-b border-paper-300 align-top">
                      <td className="py-1.5 pr-3 whitespace-nowrap">{shiftTimes(s)}</td>
                      <td className="py-1.5 pr-3">{s.siteName}</td>
                      <td className={`py-1.5 pr-3 ${s.state === 'called_off' ? 'line-through' : ''}`}>
                        <span className="font-semibold">{s.title}</span>
                        <span className="text-stone"> · {kindWords[s.kind]}</span>
                      </td>
                      <td className="py-1.5 pr-3">{placesText(s.taken, s.capacity)}</td>
                      <td className="py-1.5">
                        <Names shift={s} isCoordinator={isCoordinator} />
                      </td>
                    </tr>
                  ))}
                </tbody>
                </table>
              </div>
            </section>
          ))}
        </div>
      );
  }

  return (
    <article aria-labelledby="rota-title" className="print-sheet flex flex-col gap-3">
      <title>{`Print shifts · ${clubName} · Tillwell`}</title>
      <div className="no-print flex flex-wrap items-end justify-between gap-4">
        <Link to={paths.shifts(clubId, boardQuery ? `?${boardQuery}` : '')} className="inline-flex min-h-11 items-center gap-1.5 font-medium">
          <ArrowLeft className="size-5" aria-hidden="true" />
          Back to the shifts
        </Link>
        <Button onClick={() => window.print()}>
          <Printer className="size-5" aria-hidden="true" />
          Print
        </Button>
      </div>
      <div className="flex flex-wrap items-baseline justify-between gap-x-6 gap-y-1 border-b-2 border-soil pb-2">
        <div>
          <p className="text-sm font-semibold tracking-wide text-leaf uppercase">{clubName}</p>
          <h1 id="rota-title" className="text-2xl font-bold">
            Shift rota, {rangeLabel(week.from, week.to)}
          </h1>
        </div>
        <p className="text-stone">
          {siteName ? `${siteName} · ` : ''}Times on each site’s clock · Printed {formatDate(new Date().toISOString(), timeZone)}
        </p>
      </div>
      {body}
    </article>
  );
}
