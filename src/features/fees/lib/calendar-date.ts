import { formatDate } from '@shared/dates';

/** "2027-04-14" → "14 Apr 2027"; a calendar date has no zone, so it never shifts a day. */
export function formatCalendarDate(isoDate: string): string {
  return formatDate(isoDate, 'UTC');
}
