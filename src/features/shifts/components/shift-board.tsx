import { lazy, Suspense, useId } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { CalendarDays, CalendarPlus, ChevronLeft, ChevronRight, HandHelping, LayoutList, ListChecks, Printer } from 'lucide-react';
import { addCalendarDays, localToday } from '@shared/dates';
import type { Shift } from '@shared/schemas/shifts';
import { Badge } from '@/components/ui/badge';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Checkbox } from '@/components/ui/checkbox';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useShifts } from '../api/get-shifts';
import { readBoardParams, writeBoardParams, type BoardParams } from '../lib/board-params';
import { calendarRange } from '../lib/calendar';
import { dayHeading, groupByDay, rangeLabel, weekOf } from '../lib/dates';
import { kindOrder, kindWords, stateOrder, stateWords } from '../lib/words';
import { ShiftCard } from './shift-card';
import { stateIcons } from './state-tag';

// The calendar (react-big-calendar and its stylesheet) loads only when someone opens it, in its own chunk.
const ShiftCalendar = lazy(() => import('./shift-calendar').then((m) => ({ default: m.ShiftCalendar })));

export interface ShiftBoardProps {
  clubId: number;
  clubName: string;
  /** The club's zone: "today" and "this week" are the club's. */
  timeZone: string;
  sites: Array<{ id: number; name: string }>;
  canClaim: boolean;
  isCoordinator: boolean;
  isVolunteer: boolean;
}

function ViewToggle({ view, onChange }: { view: BoardParams['view']; onChange: (v: BoardParams['view']) => void }) {
  const option = (value: BoardParams['view'], label: string, Icon: typeof LayoutList) => (
    <Button
      variant={view === value ? 'primary' : 'secondary'}
      aria-pressed={view === value}
      onClick={() => onChange(value)}
      className="flex-1 sm:flex-none"
    >
      <Icon className="size-5" aria-hidden="true" />
      {label}
    </Button>
  );
  return (
    <div role="group" aria-label="Show the shifts as" className="flex gap-2">
      {option('list', 'List', LayoutList)}
      {option('calendar', 'Calendar', CalendarDays)}
    </div>
  );
}

/** The words of every state with its icon, so the calendar's colours never stand alone. */
function StateKey() {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-stone" aria-label="What the states mean">
      {stateOrder.map((state) => {
        const Icon = stateIcons[state];
        return (
          <li key={state} className="inline-flex items-center gap-1.5">
            <Icon className="size-4" aria-hidden="true" />
            {stateWords[state]}
          </li>
        );
      })}
    </ul>
  );
}

function WeekList({
  shifts,
  week,
  today,
  clubId,
  canClaim,
}: {
  shifts: Shift[];
  week: ReturnType<typeof weekOf>;
  today: string;
  clubId: number;
  canClaim: boolean;
}) {
  const groups = groupByDay(shifts, week.days);
  return (
    <ol className="flex flex-col gap-6">
      {groups.map((g) => {
        const headingId = `day-${g.date}`;
        return (
          <li key={g.date} aria-labelledby={headingId}>
            <h2 id={headingId} className="mb-2 flex flex-wrap items-center gap-2 text-lg font-semibold">
              {dayHeading(g.date)}
              {g.date === today && <Badge tone="leaf">Today</Badge>}
            </h2>
            {g.items.length === 0 ? (
              <p className="rounded-lg border border-dashed border-paper-300 px-4 py-3 text-stone">No shifts this day.</p>
            ) : (
              <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
                {g.items.map((s) => (
                  <li key={s.id} className="min-w-0">
                    <ShiftCard shift={s} href={paths.shift(clubId, s.id)} canClaim={canClaim} />
                  </li>
                ))}
              </ul>
            )}
          </li>
        );
      })}
    </ol>
  );
}

/**
 * `/clubs/:clubId/shifts`: the week's shifts by day (or a calendar), with filters by site and kind
 * and "only shifts that need people", all kept in the page's query.
 */
export function ShiftBoard({ clubId, clubName, timeZone, sites, canClaim, isCoordinator, isVolunteer }: ShiftBoardProps) {
  const [searchParams, setSearchParams] = useSearchParams();
  const today = localToday(timeZone);
  const params = readBoardParams(searchParams, { today, siteIds: sites.map((s) => s.id) });
  const week = weekOf(params.date);
  const range = params.view === 'list' ? { from: week.from, to: week.to } : calendarRange(params.cal, params.date);
  const shifts = useShifts({ clubId, ...range, siteId: params.siteId, kind: params.kind, open: params.open || undefined });
  const statusId = useId();

  const change = (next: Partial<BoardParams>) => setSearchParams(writeBoardParams(params, next, { today }), { replace: true });
  const filtered = Boolean(params.siteId || params.kind || params.open);
  // The printed rota is always the list's week, with the same filters.
  const printQuery = writeBoardParams(params, { view: 'list' }, { today }).toString();

  const header = (
    <>
      <title>{`Shifts · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Shifts"
        description="Watering, weeding and work days at the club's sites. Each shift's times are its site's own clock."
        actions={
          <>
            {isCoordinator && (
              <Link to={paths.shiftPlan(clubId)} className={buttonClasses('primary')}>
                <CalendarPlus className="size-5" aria-hidden="true" />
                Build shifts
              </Link>
            )}
            {isVolunteer && (
              <Link to={paths.myShifts(clubId)} className={buttonClasses('secondary')}>
                <ListChecks className="size-5" aria-hidden="true" />
                My shifts
              </Link>
            )}
            <Link to={paths.shiftsPrint(clubId, printQuery ? `?${printQuery}` : '')} className={buttonClasses('secondary')}>
              <Printer className="size-5" aria-hidden="true" />
              Print this week
            </Link>
          </>
        }
      />
    </>
  );

  const filters = (
    <form aria-label="Filters" onSubmit={(e) => e.preventDefault()} className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-[repeat(2,minmax(0,14rem))_auto] lg:items-end">
      <Select label="Site" value={String(params.siteId ?? '')} onChange={(e) => change({ siteId: e.target.value ? Number(e.target.value) : undefined })}>
        <option value="">Every site</option>
        {sites.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </Select>
      <Select label="Kind" value={params.kind ?? ''} onChange={(e) => change({ kind: kindOrder.find((k) => k === e.target.value) })}>
        <option value="">Every kind</option>
        {kindOrder.map((k) => (
          <option key={k} value={k}>
            {kindWords[k]}
          </option>
        ))}
      </Select>
      <Checkbox label="Only shifts that need people" checked={params.open} onChange={(e) => change({ open: e.target.checked })} />
    </form>
  );

  let body;
  if (shifts.isPending) body = <LoadingState label="Loading the shifts…" />;
  else if (shifts.isError) {
    body = (
      <Card>
        <ErrorState
          title="The shifts didn't load"
          message={shifts.error.message}
          requestId={isApiError(shifts.error) ? shifts.error.requestId : undefined}
          onRetry={() => void shifts.refetch()}
          retrying={shifts.isFetching}
        />
      </Card>
    );
  } else if (params.view === 'calendar') {
    body = (
      <Suspense fallback={<LoadingState label="Opening the calendar…" />}>
        <ShiftCalendar
          shifts={shifts.data.items}
          view={params.cal}
          date={params.date}
          today={today}
          timeZone={timeZone}
          clubId={clubId}
          onChange={(next) => change(next)}
        />
      </Suspense>
    );
  } else if (shifts.isPlaceholderData) {
    body = <LoadingState label={`Loading ${rangeLabel(week.from, week.to)}…`} />;
  } else if (shifts.data.items.length === 0) {
    body = (
      <Card>
        <EmptyState
          icon={HandHelping}
          title={filtered ? 'No shifts match these filters this week' : 'No shifts this week'}
          action={
            <>
              {filtered && (
                <Button variant="secondary" onClick={() => change({ siteId: undefined, kind: undefined, open: false })}>
                  Show every shift
                </Button>
              )}
              <Button variant="secondary" onClick={() => change({ date: addCalendarDays(week.from, 7) })}>
                Look at next week
              </Button>
              {isCoordinator && (
                <Link to={paths.shiftPlan(clubId)} className={buttonClasses('primary')}>
                  Build shifts
                </Link>
              )}
            </>
          }
        >
          <p>
            {isCoordinator
              ? 'Build shifts from the open tasks, or add a work day of your own.'
              : 'Coordinators add shifts as the season’s jobs come up. Look again soon, or at the next week.'}
          </p>
        </EmptyState>
      </Card>
    );
  } else {
    body = <WeekList shifts={shifts.data.items} week={week} today={today} clubId={clubId} canClaim={canClaim} />;
  }

  return (
    <>
      {header}
      <div className="flex min-w-0 flex-col gap-6">
        <div className="flex flex-col gap-4 lg:flex-row lg:items-end lg:justify-between">
          <ViewToggle view={params.view} onChange={(view) => change({ view })} />
          {params.view === 'list' && (
            <nav aria-label="Weeks" className="flex flex-wrap items-center gap-2">
              <Button variant="secondary" className="px-3" onClick={() => change({ date: addCalendarDays(week.from, -7) })} aria-label="Previous week">
                <ChevronLeft className="size-5" aria-hidden="true" />
              </Button>
              <Button variant="secondary" onClick={() => change({ date: today })} disabled={week.from === weekOf(today).from}>
                This week
              </Button>
              <Button variant="secondary" className="px-3" onClick={() => change({ date: addCalendarDays(week.from, 7) })} aria-label="Next week">
                <ChevronRight className="size-5" aria-hidden="true" />
              </Button>
              <p id={statusId} className="ml-1 font-semibold" aria-live="polite">
                {rangeLabel(week.from, week.to)}
              </p>
            </nav>
          )}
        </div>
        {filters}
        {params.view === 'calendar' && <StateKey />}
        {shifts.isFetching && !shifts.isPending && (
          <p className="sr-only" role="status">
            Updating the shifts…
          </p>
        )}
        {body}
      </div>
    </>
  );
}
