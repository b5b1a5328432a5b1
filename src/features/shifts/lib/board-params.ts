import { shiftKinds, type ShiftKind } from '@shared/schemas/shifts';
import { calendarViews, type CalendarView } from './calendar';
import { isCalendarDate, weekStartOf } from './dates';

// The board keeps everything a person chose in the page's query, so a link or a reload shows the same
// shifts: `?date=2026-07-06&site=3&kind=water&view=calendar&cal=month`. Values that are not ours are
// dropped rather than refused, so an old or mistyped link still opens the board.

export type BoardView = 'list' | 'calendar';

export interface BoardParams {
  /** The list's week starts on this Monday; the calendar's view is around this date. */
  date: string;
  siteId?: number;
  kind?: ShiftKind;
  /** Only the shifts that still need people. */
  open: boolean;
  view: BoardView;
  cal: CalendarView;
}

export interface BoardDefaults {
  /** Today at the club (YYYY-MM-DD). */
  today: string;
  /** The sites a `site` value may name. */
  siteIds: readonly number[];
}

function pick<T extends string>(value: string | null, allowed: readonly T[]): T | undefined {
  return allowed.find((a) => a === value);
}

/** The board's choices read from the page's query; anything unknown falls back to the default. */
export function readBoardParams(params: URLSearchParams, { today, siteIds }: BoardDefaults): BoardParams {
  const view = params.get('view') === 'calendar' ? 'calendar' : 'list';
  const raw = params.get('date');
  const anchor = isCalendarDate(raw) ? raw : today;
  const site = Number(params.get('site'));
  return {
    // The list shows whole weeks: any date in a week opens that week.
    date: view === 'list' ? weekStartOf(anchor) : anchor,
    siteId: siteIds.includes(site) ? site : undefined,
    kind: pick(params.get('kind'), shiftKinds),
    open: params.get('open') === 'true',
    view,
    cal: pick(params.get('cal'), calendarViews) ?? 'month',
  };
}

/**
 * The query for a change of choices, keeping the others: defaults are left out so links stay short
 * (no date for this week, no view for the list, no `cal` for the month).
 */
export function writeBoardParams(current: BoardParams, change: Partial<BoardParams>, { today }: Pick<BoardDefaults, 'today'>): URLSearchParams {
  const next = { ...current, ...change };
  const q = new URLSearchParams();
  const isToday = next.view === 'list' ? weekStartOf(next.date) === weekStartOf(today) : next.date === today;
  if (!isToday) q.set('date', next.date);
  if (next.siteId !== undefined) q.set('site', String(next.siteId));
  if (next.kind) q.set('kind', next.kind);
  if (next.open) q.set('open', 'true');
  if (next.view === 'calendar') {
    q.set('view', 'calendar');
    if (next.cal !== 'month') q.set('cal', next.cal);
  }
  return q;
}

/** The filters as GET /api/clubs/:clubId/shifts reads them (`?from&to&siteId&kind&open=true`), only those set. */
export function shiftsApiQuery(f: { from: string; to: string; siteId?: number; kind?: ShiftKind; open?: boolean }): string {
  const q = new URLSearchParams({ from: f.from, to: f.to });
  if (f.siteId !== undefined) q.set('siteId', String(f.siteId));
  if (f.kind) q.set('kind', f.kind);
  if (f.open) q.set('open', 'true');
  return `?${q.toString()}`;
}
