import { TZDate } from '@date-fns/tz';
import { formatPattern as format } from '@shared/dates/pattern';
import { addCalendarDays, localToday, zoneName } from '@shared/dates';

// A shift's date and times are its site's own: the calendar date is the site's day, and the
// instants are shown as the wall clock of the site's zone (`shift.timeZone`), never the reader's.
// The board works in calendar dates (YYYY-MM-DD) and weeks that start on Monday (ISO 8601).

const CALENDAR_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A YYYY-MM-DD date as a UTC midnight, or null when the text is not a real calendar date. */
function utcDay(iso: string): Date | null {
  const m = CALENDAR_DATE.exec(iso);
  if (!m) return null;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const day = new Date(Date.UTC(y, mo - 1, d));
  return day.getUTCFullYear() === y && day.getUTCMonth() === mo - 1 && day.getUTCDate() === d ? day : null;
}

/** Whether the text is a real calendar date written YYYY-MM-DD. */
export function isCalendarDate(text: string | null | undefined): text is string {
  return typeof text === 'string' && utcDay(text) !== null;
}

/** The same calendar date as a TZDate in UTC, so date-fns formats exactly that day. */
function dayFor(iso: string): TZDate {
  const d = utcDay(iso);
  if (!d) throw new RangeError(`Not a calendar date: ${iso}`);
  return new TZDate(d.getTime(), 'UTC');
}

/** 0 for Monday … 6 for Sunday. */
function mondayIndex(iso: string): number {
  return (dayFor(iso).getDay() + 6) % 7;
}

/** The Monday on or before a calendar date. */
export function weekStartOf(iso: string): string {
  return addCalendarDays(iso, -mondayIndex(iso));
}

export interface WeekRange {
  /** Monday. */
  from: string;
  /** Sunday. */
  to: string;
  /** The seven dates, Monday first. */
  days: string[];
}

/** The Monday-to-Sunday week holding a calendar date. */
export function weekOf(iso: string): WeekRange {
  const from = weekStartOf(iso);
  const days = Array.from({ length: 7 }, (_, i) => addCalendarDays(from, i));
  return { from, to: days[6], days };
}

/** This week where the clock is in `timeZone`: the week of today's date there. */
export function thisWeek(timeZone: string, now: Date = new Date()): WeekRange {
  return weekOf(localToday(timeZone, now));
}

/** "6–12 Jul 2026", "29 Jun – 5 Jul 2026", "28 Dec 2026 – 3 Jan 2027": a range of dates, short. */
export function rangeLabel(from: string, to: string): string {
  const a = dayFor(from);
  const b = dayFor(to);
  if (from.slice(0, 4) !== to.slice(0, 4)) return `${format(a, 'd MMM yyyy')} – ${format(b, 'd MMM yyyy')}`;
  if (from.slice(0, 7) !== to.slice(0, 7)) return `${format(a, 'd MMM')} – ${format(b, 'd MMM yyyy')}`;
  return `${format(a, 'd')}–${format(b, 'd MMM yyyy')}`;
}

/** "Monday 6 July": a day's heading on the board. */
export function dayHeading(iso: string): string {
  return format(dayFor(iso), 'EEEE d MMMM');
}

/** "Tue 14 Jul 2026": a calendar date, short, with its weekday. */
export function dayShort(iso: string): string {
  return format(dayFor(iso), 'EEE d MMM yyyy');
}

/** The calendar dates from `from` to `to`, both included (empty when `to` is before `from`). */
export function datesBetween(from: string, to: string): string[] {
  const out: string[] = [];
  for (let d = from; d <= to; d = addCalendarDays(d, 1)) out.push(d);
  return out;
}

/** What the time helpers need of a shift. */
export type ShiftTimes = { date: string; startsAt: string; endsAt: string; timeZone: string };

/** "18:00" for an instant, on the wall clock of `timeZone`. */
export function clockIn(instant: string, timeZone: string): string {
  return format(new TZDate(new Date(instant).getTime(), timeZone), 'HH:mm');
}

/** "18:00–20:00 EDT": the shift's hours on its site's clock, with the zone's short name. */
export function shiftTimes(s: ShiftTimes): string {
  return `${clockIn(s.startsAt, s.timeZone)}–${clockIn(s.endsAt, s.timeZone)} ${zoneName(s.timeZone, new Date(s.startsAt))}`;
}

/** "Tue 14 Jul 2026, 18:00–20:00 EDT": when the shift is, in its site's zone. */
export function shiftWhen(s: ShiftTimes): string {
  return `${dayShort(s.date)}, ${shiftTimes(s)}`;
}

/** "Tuesday 14 July 2026 from 18:00 to 20:00 EDT": the same, for sentences and confirmations. */
export function shiftWhenWords(s: ShiftTimes): string {
  return `${format(dayFor(s.date), 'EEEE d MMMM yyyy')} from ${clockIn(s.startsAt, s.timeZone)} to ${clockIn(s.endsAt, s.timeZone)} ${zoneName(
    s.timeZone,
    new Date(s.startsAt),
  )}`;
}

export interface DayGroup<T> {
  date: string;
  items: T[];
}

/**
 * Shifts (or suggestions) by their site's date, each day's in starting order. With `days` every one
 * of those dates gets a group, empty or not, in that order; without, only the dates that have items,
 * earliest first.
 */
export function groupByDay<T extends { date: string; startsAt?: string; startTime?: string; title: string }>(items: readonly T[], days?: readonly string[]): DayGroup<T>[] {
  const byDate = new Map<string, T[]>();
  for (const item of items) {
    const list = byDate.get(item.date);
    if (list) list.push(item);
    else byDate.set(item.date, [item]);
  }
  const order = (a: T, b: T) => {
    const ka = a.startsAt ?? a.startTime ?? '';
    const kb = b.startsAt ?? b.startTime ?? '';
    // Instants written by one server compare as text only in one format, so compare them as times.
    const ta = a.startsAt ? Date.parse(a.startsAt) : NaN;
    const tb = b.startsAt ? Date.parse(b.startsAt) : NaN;
    const byTime = Number.isNaN(ta) || Number.isNaN(tb) ? ka.localeCompare(kb) : ta - tb;
    return byTime || a.title.localeCompare(b.title);
  };
  const dates = days ? [...days] : [...byDate.keys()].sort();
  return dates.map((date) => ({ date, items: [...(byDate.get(date) ?? [])].sort(order) }));
}
