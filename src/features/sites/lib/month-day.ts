// A fixed leap year, so 29 February is a choice and month names come from one calendar.
const LEAP_YEAR = 2028;
const longMonth = new Intl.DateTimeFormat('en-GB', { month: 'long', timeZone: 'UTC' });
const shortMonth = new Intl.DateTimeFormat('en-GB', { month: 'short', timeZone: 'UTC' });

/** The twelve months as `{ value: "01", label: "January" }`. */
export const monthOptions = Array.from({ length: 12 }, (_, i) => ({
  value: String(i + 1).padStart(2, '0'),
  label: longMonth.format(Date.UTC(LEAP_YEAR, i, 1)),
}));

/** How many days a month can have ("02" → 29); 31 for an unknown month. */
export function daysInMonth(month: string): number {
  const m = Number(month);
  if (!Number.isInteger(m) || m < 1 || m > 12) return 31;
  return new Date(Date.UTC(LEAP_YEAR, m, 0)).getUTCDate();
}

/** A frost date such as "04-25" as "25 Apr"; null or unreadable values give null. */
export function formatMonthDay(value: string | null): string | null {
  const match = value ? /^(\d\d)-(\d\d)$/.exec(value) : null;
  if (!match) return null;
  const month = Number(match[1]);
  const day = Number(match[2]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(match[1])) return null;
  return `${day} ${shortMonth.format(Date.UTC(LEAP_YEAR, month - 1, 1))}`;
}
