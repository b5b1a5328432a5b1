import { describe, expect, it } from 'vitest';
import { dayHeading, groupByDay, isCalendarDate, rangeLabel, shiftTimes, shiftWhen, shiftWhenWords, thisWeek, weekOf, weekStartOf } from './dates';

describe('weeks on the board (Monday to Sunday, ISO 8601)', () => {
  it('finds the Monday on or before any date', () => {
    // 6 July 2026 is a Monday (any 2026 calendar).
    expect(weekStartOf('2026-07-06')).toBe('2026-07-06');
    expect(weekStartOf('2026-07-08')).toBe('2026-07-06');
    expect(weekStartOf('2026-07-12')).toBe('2026-07-06');
    expect(weekStartOf('2026-07-13')).toBe('2026-07-13');
    // 1 January 2027 is a Friday, so its week began on Monday 28 December 2026.
    expect(weekStartOf('2027-01-01')).toBe('2026-12-28');
  });

  it('lists the seven days of a week, across a month end and a year end', () => {
    expect(weekOf('2026-07-01')).toEqual({
      from: '2026-06-29',
      to: '2026-07-05',
      days: ['2026-06-29', '2026-06-30', '2026-07-01', '2026-07-02', '2026-07-03', '2026-07-04', '2026-07-05'],
    });
    expect(weekOf('2026-12-31').days).toEqual(['2026-12-28', '2026-12-29', '2026-12-30', '2026-12-31', '2027-01-01', '2027-01-02', '2027-01-03']);
    // 2028 is a leap year: 29 February 2028 is a Tuesday.
    expect(weekOf('2028-02-29').days).toContain('2028-02-29');
    expect(weekOf('2028-02-29').from).toBe('2028-02-28');
  });

  it('works out this week from today in the zone asked, not the machine’s', () => {
    // 23:30 UTC on Sunday 5 July 2026 is already 01:30 on Monday 6 July in Berlin (CEST, UTC+2)
    // but still 19:30 on Sunday in New York (EDT, UTC−4): two different weeks.
    const now = new Date('2026-07-05T23:30:00Z');
    expect(thisWeek('Europe/Berlin', now).from).toBe('2026-07-06');
    expect(thisWeek('America/New_York', now).from).toBe('2026-06-29');
    expect(thisWeek('America/New_York', now).to).toBe('2026-07-05');
  });

  it('labels a range short, naming the month and year once where it can', () => {
    expect(rangeLabel('2026-07-06', '2026-07-12')).toBe('6–12 Jul 2026');
    expect(rangeLabel('2026-06-29', '2026-07-05')).toBe('29 Jun – 5 Jul 2026');
    expect(rangeLabel('2026-12-28', '2027-01-03')).toBe('28 Dec 2026 – 3 Jan 2027');
    expect(dayHeading('2026-07-06')).toBe('Monday 6 July');
  });

  it('tells real calendar dates from look-alikes', () => {
    expect(isCalendarDate('2026-07-06')).toBe(true);
    expect(isCalendarDate('2026-02-30')).toBe(false);
    expect(isCalendarDate('6/7/2026')).toBe(false);
    expect(isCalendarDate(null)).toBe(false);
  });
});

describe('a shift’s times, on its site’s clock', () => {
  it('shows the site’s wall clock and zone name whatever zone the reader is in', () => {
    // 17:00 UTC is 18:00 in London in July (summer time, UTC+1). The zone's short name is the runtime's
    // (ICU's English names: "GMT+1" for London in summer, "EDT" for New York), as shared/dates shows them.
    const london = { date: '2026-07-14', startsAt: '2026-07-14T17:00:00.000Z', endsAt: '2026-07-14T19:00:00.000Z', timeZone: 'Europe/London' };
    expect(shiftTimes(london)).toBe('18:00–20:00 GMT+1');
    expect(shiftWhen(london)).toBe('Tue 14 Jul 2026, 18:00–20:00 GMT+1');
    expect(shiftWhenWords(london)).toBe('Tuesday 14 July 2026 from 18:00 to 20:00 GMT+1');
    // 22:00 UTC is 18:00 in New York in July (EDT, UTC−4).
    const ny = { date: '2026-07-14', startsAt: '2026-07-14T22:00:00Z', endsAt: '2026-07-15T00:30:00Z', timeZone: 'America/New_York' };
    expect(shiftTimes(ny)).toBe('18:00–20:30 EDT');
  });

  it('follows the zone’s clock change: the same 10:00 start is a different UTC hour in winter', () => {
    // London is on GMT (UTC+0) in January, so 10:00 UTC reads 10:00 GMT.
    expect(shiftTimes({ date: '2027-01-09', startsAt: '2027-01-09T10:00:00Z', endsAt: '2027-01-09T12:00:00Z', timeZone: 'Europe/London' })).toBe(
      '10:00–12:00 GMT',
    );
  });
});

describe('grouping shifts by day', () => {
  const s = (id: number, date: string, startsAt: string, title = `Shift ${id}`) => ({ id, date, startsAt, title });

  it('gives every day of the week a group, empty days too, each day’s shifts in starting order', () => {
    const week = weekOf('2026-07-06').days;
    const groups = groupByDay(
      [s(1, '2026-07-08', '2026-07-08T17:00:00Z'), s(2, '2026-07-06', '2026-07-06T09:00:00Z'), s(3, '2026-07-08', '2026-07-08T08:00:00Z')],
      week,
    );
    expect(groups.map((g) => g.date)).toEqual(week);
    expect(groups[0].items.map((i) => i.id)).toEqual([2]);
    expect(groups[1].items).toEqual([]);
    expect(groups[2].items.map((i) => i.id)).toEqual([3, 1]);
  });

  it('orders by the instant, not the text, and by title when two start together', () => {
    const groups = groupByDay([
      // 09:30+02:00 is 07:30 UTC, earlier than 08:00Z, although its text sorts later.
      s(1, '2026-07-08', '2026-07-08T08:00:00Z', 'B'),
      s(2, '2026-07-08', '2026-07-08T09:30:00+02:00', 'Z'),
      s(3, '2026-07-08', '2026-07-08T08:00:00Z', 'A'),
    ]);
    expect(groups).toHaveLength(1);
    expect(groups[0].items.map((i) => i.id)).toEqual([2, 3, 1]);
  });

  it('groups suggestions (dates and wall-clock times only) by their dates, earliest first', () => {
    const groups = groupByDay([
      { date: '2026-07-10', startTime: '18:00', title: 'Watering' },
      { date: '2026-07-09', startTime: '10:00', title: 'Weeding' },
      { date: '2026-07-10', startTime: '09:00', title: 'Mulching' },
    ]);
    expect(groups.map((g) => [g.date, g.items.map((i) => i.title)])).toEqual([
      ['2026-07-09', ['Weeding']],
      ['2026-07-10', ['Mulching', 'Watering']],
    ]);
  });
});
