import { TZDate, tzName } from '@date-fns/tz';
import { addDays, endOfDay, isValid, parseISO } from 'date-fns';
import { formatPattern as format } from './pattern';

// Every date and time a person sees goes through here, in the club's or the site's time zone
// (an IANA name such as "Europe/London"). One format for dates, one for dates with a time.

const DATE = 'd MMM yyyy';
const DATE_TIME = 'd MMM yyyy, HH:mm';
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

function instant(value: Date | string): Date | null {
  const d = typeof value === 'string' ? parseISO(value) : value;
  return isValid(d) ? d : null;
}

/** A calendar date "YYYY-MM-DD" read as that day (no zone can shift it), or null when it is not one. */
function calendarDay(value: string): TZDate | null {
  if (!CALENDAR_DATE.test(value)) return null;
  const [y, m, d] = value.split('-').map(Number);
  const day = new TZDate(y, m - 1, d, 'UTC');
  return day.getUTCFullYear() === y && day.getUTCMonth() === m - 1 && day.getUTCDate() === d ? day : null;
}

/**
 * "31 Mar 2027". An instant is shown as the day it is in `timeZone`; a calendar date
 * ("2027-03-31", such as a fee's due date) is shown as that day. Unreadable input comes back as it is.
 */
export function formatDate(value: Date | string, timeZone: string): string {
  if (typeof value === 'string') {
    const day = calendarDay(value);
    if (day) return format(day, DATE);
  }
  const d = instant(value);
  return d ? format(new TZDate(d, timeZone), DATE) : String(value);
}

/** "31 Mar 2027, 23:59 BST": the instant's wall-clock time in `timeZone`, with the zone's short name. */
export function formatDateTime(value: Date | string, timeZone: string): string {
  const d = instant(value);
  if (!d) return String(value);
  return `${format(new TZDate(d, timeZone), DATE_TIME)} ${zoneName(timeZone, d)}`;
}

/** The zone's short name at that instant ("GMT", "BST", "CET"; "GMT+2" where no common name exists). */
export function zoneName(timeZone: string, at: Date): string {
  return tzName(timeZone, at, 'short');
}

/** Whether `timeZone` is a zone name this runtime knows (IANA names such as "Europe/London", or "UTC"). */
export function isTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return true;
  } catch {
    return false;
  }
}

/** Today's date in `timeZone` as YYYY-MM-DD. */
export function localToday(timeZone: string, now: Date = new Date()): string {
  return format(new TZDate(now, timeZone), 'yyyy-MM-dd');
}

/** The calendar date `days` after `isoDate` (YYYY-MM-DD in, YYYY-MM-DD out). */
export function addCalendarDays(isoDate: string, days: number): string {
  const day = calendarDay(isoDate);
  if (!day) throw new RangeError(`Not a calendar date: ${isoDate}`);
  return format(addDays(day, days), 'yyyy-MM-dd');
}

/**
 * The last second of a calendar day in `timeZone`, as an instant: a deadline entered as
 * "2027-03-31" lasts until 23:59:59 local time that day, whatever the zone's offset then.
 */
export function endOfLocalDay(isoDate: string, timeZone: string): Date {
  const day = calendarDay(isoDate);
  if (!day) throw new RangeError(`Not a calendar date: ${isoDate}`);
  const local = new TZDate(day.getUTCFullYear(), day.getUTCMonth(), day.getUTCDate(), timeZone);
  const end = endOfDay(local);
  // Deadlines are kept to the second.
  return new Date(Math.floor(end.getTime() / 1000) * 1000);
}

/** A deadline `days` calendar days from today in `timeZone`, at the end of that day: the rule offers and renewals share. */
export function deadlineAfterDays(days: number, timeZone: string, now: Date = new Date()): Date {
  return endOfLocalDay(addCalendarDays(localToday(timeZone, now), days), timeZone);
}

/** The calendar date (YYYY-MM-DD) an instant falls on in `timeZone`. */
export function localDateOf(value: Date | string, timeZone: string): string {
  const d = instant(value);
  if (!d) throw new RangeError(`Not a date: ${String(value)}`);
  return format(new TZDate(d, timeZone), 'yyyy-MM-dd');
}

/**
 * The renewal deadline to suggest for a new season (a calendar date in the club's zone): the club's
 * days to answer from today, but never on or before the previous season's deadline; when the
 * previous round closed on a date a year earlier, the same date again, so the round keeps its time of year.
 */
export function suggestRenewalDeadline(opts: { today: string; renewalDays: number; previousDeadline: string | null }): string {
  const fromToday = addCalendarDays(opts.today, opts.renewalDays);
  if (!opts.previousDeadline) return fromToday;
  const [y, m, d] = opts.previousDeadline.split('-').map(Number);
  // 29 February has no twin next year: take 28 February.
  const sameDayNextYear = m === 2 && d === 29 ? `${y + 1}-02-28` : `${y + 1}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`;
  const candidates = [fromToday, sameDayNextYear].filter((c) => c > (opts.previousDeadline as string));
  return candidates.sort()[candidates.length - 1] ?? addCalendarDays(opts.previousDeadline, 1);
}
