import { TZDate } from '@date-fns/tz';
import { addDays, differenceInCalendarDays } from 'date-fns';
import { formatPattern as format } from '@shared/dates/pattern';

// Task dates are calendar dates (YYYY-MM-DD) that are already the site's days, worked out by the server in
// the site's time zone; they are read as those days and never shifted by the reader's own zone.

const CALENDAR_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function day(iso: string): TZDate | null {
  const m = CALENDAR_DATE.exec(iso);
  if (!m) return null;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const value = new TZDate(y, mo - 1, d, 'UTC');
  return value.getUTCFullYear() === y && value.getUTCMonth() === mo - 1 && value.getUTCDate() === d ? value : null;
}

/** Whether the text is a real calendar date written YYYY-MM-DD. */
export function isCalendarDate(text: string): boolean {
  return day(text) !== null;
}

/** "Tue 9 Jun", with the year ("Tue 9 Jun 2026") when it is not the year of `today`; unreadable input comes back as it is. */
export function taskDate(iso: string, today?: string): string {
  const d = day(iso);
  if (!d) return iso;
  const sameYear = today !== undefined && today.slice(0, 4) === iso.slice(0, 4);
  return format(d, sameYear || today === undefined ? 'EEE d MMM' : 'EEE d MMM yyyy');
}

/**
 * A task's window in plain dates: "Tue 9 Jun – Sun 14 Jun"; one date when it is a single day. Years are named when
 * the window is not in `today`'s year, or runs across the new year.
 */
export function taskWindow(from: string, to: string, today?: string): string {
  if (from === to) return taskDate(from, today);
  const crossesYear = from.slice(0, 4) !== to.slice(0, 4);
  // Across the new year both ends carry their year, whatever year today is.
  const ref = crossesYear ? '0000-00-00' : today;
  return `${taskDate(from, ref)} – ${taskDate(to, ref)}`;
}

/** "Tue 9 Jun to Sun 14 Jun": the window for reading aloud and in sentences. */
export function taskWindowWords(from: string, to: string, today?: string): string {
  return taskWindow(from, to, today).replace(' – ', ' to ');
}

/** The calendar date `days` after `iso`. */
export function addDaysTo(iso: string, days: number): string {
  const d = day(iso);
  if (!d) throw new RangeError(`Not a calendar date: ${iso}`);
  return format(addDays(d, days), 'yyyy-MM-dd');
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const a = day(from);
  const b = day(to);
  if (!a || !b) throw new RangeError(`Not calendar dates: ${from}, ${to}`);
  return differenceInCalendarDays(b, a);
}

/** "Due today", "Due tomorrow", "Due in 3 days", "1 day overdue", "4 days overdue", relative to the site's today. */
export function dueWords(dueOn: string, today: string): string {
  const n = daysBetween(today, dueOn);
  if (n === 0) return 'Due today';
  if (n === 1) return 'Due tomorrow';
  if (n > 1) return `Due in ${n} days`;
  return `${-n} ${n === -1 ? 'day' : 'days'} overdue`;
}

/** "8 Jun": a week's first day, short, for a chart's axis. */
export function shortDate(iso: string): string {
  const d = day(iso);
  return d ? format(d, 'd MMM') : iso;
}
