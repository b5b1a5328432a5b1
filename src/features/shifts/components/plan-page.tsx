import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { CalendarPlus, ListChecks, Sprout } from 'lucide-react';
import { addCalendarDays, localToday } from '@shared/dates';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { TextField } from '@/components/ui/field';
import { NoticeToast, type Notice } from '@/components/ui/notice-toast';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useShiftSuggestions } from '../api/get-shift-suggestions';
import { dayHeading, groupByDay, isCalendarDate, rangeLabel } from '../lib/dates';
import { OwnShiftDialog } from './own-shift-dialog';
import { SuggestionCard } from './suggestion-card';

/** How far ahead "Build shifts" looks unless told otherwise: the next 14 days, today included. */
export const PLAN_DAYS = 14;
/** The longest range the server answers at once (as the board). */
const MAX_DAYS = 92;

export interface PlanPageProps {
  clubId: number;
  clubName: string;
  timeZone: string;
  sites: Array<{ id: number; name: string; units: 'metric' | 'us' }>;
}

/** The range from the page's query (`?from&to&site`), the next 14 days when it is missing or not a real range. */
function readRange(params: URLSearchParams, today: string, siteIds: number[]) {
  const from = params.get('from');
  const to = params.get('to');
  const ok =
    isCalendarDate(from) && isCalendarDate(to) && from <= to && (Date.parse(to) - Date.parse(from)) / 86_400_000 <= MAX_DAYS;
  const site = Number(params.get('site'));
  return {
    from: ok ? from : today,
    to: ok ? to : addCalendarDays(today, PLAN_DAYS - 1),
    siteId: siteIds.includes(site) ? site : undefined,
  };
}

/**
 * `/clubs/:clubId/shifts/plan` (coordinators): the open tasks of a range grouped into suggested
 * shifts by day; each is created in one click, or changed first. A work day of one's own is added
 * from a dialog. Created suggestions leave the list, because it is read again.
 */
export function PlanPage({ clubId, clubName, timeZone, sites }: PlanPageProps) {
  const [params, setParams] = useSearchParams();
  const today = localToday(timeZone);
  const range = readRange(params, today, sites.map((s) => s.id));
  const [draft, setDraft] = useState({ from: range.from, to: range.to });
  const [rangeError, setRangeError] = useState<string | null>(null);
  const [ownOpen, setOwnOpen] = useState(false);
  const [notice, setNotice] = useState<Notice | null>(null);
  const suggestions = useShiftSuggestions({ clubId, ...range });
  const unitsOf = new Map(sites.map((s) => [s.id, s.units]));

  const setQuery = (next: { from: string; to: string; siteId?: number }) => {
    const q = new URLSearchParams({ from: next.from, to: next.to });
    if (next.siteId !== undefined) q.set('site', String(next.siteId));
    setParams(q, { replace: true });
  };

  const applyRange = () => {
    if (!isCalendarDate(draft.from) || !isCalendarDate(draft.to)) return setRangeError('Give both dates, like 2026-07-06.');
    if (draft.to < draft.from) return setRangeError('The end is before the start.');
    if ((Date.parse(draft.to) - Date.parse(draft.from)) / 86_400_000 > MAX_DAYS) return setRangeError(`At most ${MAX_DAYS} days at a time.`);
    setRangeError(null);
    setQuery({ ...range, from: draft.from, to: draft.to });
  };

  const created = (title: string) => setNotice({ tone: 'success', text: `“${title}” is on the board. Volunteers can take places now.` });

  let body;
  if (suggestions.isPending) body = <LoadingState label="Grouping the open tasks…" />;
  else if (suggestions.isError) {
    body = (
      <Card>
        <ErrorState
          title="The suggestions didn't load"
          message={suggestions.error.message}
          requestId={isApiError(suggestions.error) ? suggestions.error.requestId : undefined}
          onRetry={() => void suggestions.refetch()}
          retrying={suggestions.isFetching}
        />
      </Card>
    );
  } else if (suggestions.data.items.length === 0) {
    body = (
      <Card>
        <EmptyState
          icon={Sprout}
          title="Every open task of these dates is in a shift"
          action={
            <Button onClick={() => setOwnOpen(true)}>
              <CalendarPlus className="size-5" aria-hidden="true" />
              Add a shift of your own
            </Button>
          }
        >
          <p>Or no tasks are open for volunteers {rangeLabel(range.from, range.to)}. Try later dates, or add a work day of your own.</p>
        </EmptyState>
      </Card>
    );
  } else {
    const groups = groupByDay(suggestions.data.items);
    body = (
      <ol className="flex flex-col gap-8" aria-busy={suggestions.isFetching || undefined}>
        {groups.map((g) => (
          <li key={g.date} aria-labelledby={`plan-${g.date}`}>
            <h2 id={`plan-${g.date}`} className="mb-3 text-xl font-semibold">
              {dayHeading(g.date)}
            </h2>
            <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
              {g.items.map((s) => (
                <li key={`${s.siteId}-${s.date}-${s.kind}-${s.startTime}-${s.taskIds.join('.')}`} className="min-w-0">
                  <SuggestionCard clubId={clubId} suggestion={s} units={unitsOf.get(s.siteId)} onCreated={(shift) => created(shift.title)} />
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ol>
    );
  }

  return (
    <>
      <title>{`Build shifts · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Build shifts"
        description="The open tasks of the coming days, grouped by site, day and kind of work. Create each as suggested or change it first; the hours are our estimate from the tasks."
        actions={
          <>
            <Button onClick={() => setOwnOpen(true)}>
              <CalendarPlus className="size-5" aria-hidden="true" />
              Add a shift of your own
            </Button>
            <Link to={paths.shifts(clubId)} className={buttonClasses('secondary')}>
              <ListChecks className="size-5" aria-hidden="true" />
              The shift board
            </Link>
          </>
        }
      />
      <div className="flex min-w-0 flex-col gap-6">
        <form
          aria-label="Dates and site"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            applyRange();
          }}
          className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-[repeat(3,minmax(0,12rem))_auto] lg:items-end"
        >
          <TextField label="From" type="date" value={draft.from} onChange={(e) => setDraft((d) => ({ ...d, from: e.target.value }))} error={rangeError ?? undefined} />
          <TextField label="To" type="date" value={draft.to} onChange={(e) => setDraft((d) => ({ ...d, to: e.target.value }))} />
          <Select label="Site" value={String(range.siteId ?? '')} onChange={(e) => setQuery({ ...range, siteId: e.target.value ? Number(e.target.value) : undefined })}>
            <option value="">Every site</option>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </Select>
          <Button type="submit" variant="secondary">
            Show these dates
          </Button>
        </form>
        <p className="font-semibold" aria-live="polite">
          Suggestions for {rangeLabel(range.from, range.to)}
        </p>
        {body}
      </div>
      <OwnShiftDialog
        open={ownOpen}
        clubId={clubId}
        sites={range.siteId ? sites.filter((s) => s.id === range.siteId) : sites}
        date={range.from}
        onCancel={() => setOwnOpen(false)}
        onCreated={(shift) => {
          setOwnOpen(false);
          created(shift.title);
        }}
      />
      <NoticeToast notice={notice} onDismiss={() => setNotice(null)} />
    </>
  );
}
