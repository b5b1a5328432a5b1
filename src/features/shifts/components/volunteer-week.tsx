import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { LoadingState } from '@/components/ui/spinner';
import { plural } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useTimeZone } from '@/lib/time-zone';
import { useMyShifts } from '../api/get-my-shifts';
import { useShifts } from '../api/get-shifts';
import { rangeLabel, shiftWhen, thisWeek } from '../lib/dates';

const box = 'flex min-w-0 flex-col gap-2 rounded-xl border border-leaf-100 bg-white p-5 shadow-sm';
const linkClass = 'mt-auto inline-flex min-h-11 items-center self-start font-semibold text-water underline underline-offset-2';

/** A volunteer's week on the club home: open shifts this week, their next place, and their hours against the club's ask. */
export function VolunteerWeek({ clubId }: { clubId: number }) {
  const zone = useTimeZone();
  const week = thisWeek(zone);
  const open = useShifts({ clubId, from: week.from, to: week.to, open: true });
  const mine = useMyShifts(clubId);
  if (open.isPending || mine.isPending) {
    return (
      <div className="mb-4">
        <LoadingState inline label="Loading your shifts…" />
      </div>
    );
  }
  if (open.isError || mine.isError) return <Alert tone="error">Your shifts didn't load. {(open.error ?? mine.error)?.message}</Alert>;
  const openShifts = open.data.items.filter((s) => s.state === 'needs_people');
  const next = mine.data.upcoming.find((s) => s.myClaim?.status === 'taken');
  const { hours, required } = mine.data.hours;
  const share = required ? Math.min(1, hours / required) : 0;
  return (
    <ul className="mb-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-3" aria-label="Your week as a volunteer">
      <li className={box} data-testid="volunteer-open">
        <h3 className="text-lg font-semibold">Open this week</h3>
        <p>
          <strong className="text-2xl">{openShifts.length}</strong> {openShifts.length === 1 ? 'shift needs' : 'shifts need'} people,{' '}
          {rangeLabel(week.from, week.to)}
        </p>
        {openShifts.length > 0 && (
          <ul className="space-y-1 text-sm">
            {openShifts.slice(0, 3).map((s) => (
              <li key={s.id}>
                <Link to={paths.shift(clubId, s.id)} className="inline-block py-3 text-water underline underline-offset-2">
                  {s.title}
                </Link>{' '}
                · {shiftWhen(s)} · {s.capacity - s.taken} of {plural(s.capacity, 'place')} open
              </li>
            ))}
          </ul>
        )}
        <Link to={paths.shifts(clubId, '?open=true')} className={linkClass}>
          See the open shifts
        </Link>
      </li>
      <li className={box} data-testid="volunteer-next">
        <h3 className="text-lg font-semibold">My next shift</h3>
        {next ? (
          <p>
            <Link to={paths.shift(clubId, next.id)} className="font-semibold text-water underline underline-offset-2">
              {next.title}
            </Link>
            <br />
            {shiftWhen(next)} at {next.siteName}
          </p>
        ) : (
          <p className="text-stone">You have no place on a shift yet.</p>
        )}
        <Link to={paths.myShifts(clubId)} className={linkClass}>
          See my shifts
        </Link>
      </li>
      <li className={box} data-testid="volunteer-hours">
        <h3 className="text-lg font-semibold">My hours in {mine.data.year}</h3>
        <p>
          <strong className="text-2xl">{hours}</strong> {required ? `of ${plural(required, 'hour')} the club asks` : hours === 1 ? 'hour' : 'hours'}
          {mine.data.hours.remaining ? `; ${plural(mine.data.hours.remaining, 'hour')} to go` : ''}
        </p>
        {required ? (
          // The same figure as the words above, drawn; the words carry it for everyone.
          <div aria-hidden="true" className="h-3 overflow-hidden rounded-sm border border-stone bg-white">
            <div className="h-full bg-leaf" style={{ width: `${Math.round(share * 100)}%` }} />
          </div>
        ) : null}
        <Link to={paths.myShifts(clubId)} className={linkClass}>
          See my hours
        </Link>
      </li>
    </ul>
  );
}
