import { describe, expect, it } from 'vitest';
import { addCalendarDays, endOfLocalDay, formatDate, formatDateTime, localDateOf, localToday, suggestRenewalDeadline } from './index';

// Zone rules from the IANA tz database. UK summer time (from memory, the UK rule since 1981):
// clocks go forward at 01:00 UTC on the last Sunday of March and back at 01:00 UTC on the last
// Sunday of October. In 2027 the last Sunday of March is 28 March (calendar).

describe('endOfLocalDay', () => {
  it('ends a deadline at 23:59:59 local time on either side of the March change in London', () => {
    // 28 March 2027 is already summer time (BST = UTC+1): 23:59:59 BST is 22:59:59Z.
    expect(endOfLocalDay('2027-03-28', 'Europe/London').toISOString()).toBe('2027-03-28T22:59:59.000Z');
    // 27 March 2027 is still winter time (GMT = UTC+0).
    expect(endOfLocalDay('2027-03-27', 'Europe/London').toISOString()).toBe('2027-03-27T23:59:59.000Z');
  });

  it('uses the zone it is given, not the machine’s', () => {
    // New Zealand: NZDT (UTC+13) until the first Sunday of April, 4 April 2027 (IANA tz database, from memory).
    expect(endOfLocalDay('2027-03-31', 'Pacific/Auckland').toISOString()).toBe('2027-03-31T10:59:59.000Z');
    expect(endOfLocalDay('2027-03-31', 'UTC').toISOString()).toBe('2027-03-31T23:59:59.000Z');
  });

  it('refuses something that is not a calendar date', () => {
    expect(() => endOfLocalDay('2027-02-30', 'Europe/London')).toThrow(RangeError);
    expect(() => endOfLocalDay('31/03/2027', 'Europe/London')).toThrow(RangeError);
  });
});

describe('formatting in a zone', () => {
  it('shows an instant as the wall-clock time in the zone, with the zone', () => {
    expect(formatDateTime('2027-03-28T22:59:59Z', 'Europe/London')).toBe('28 Mar 2027, 23:59 GMT+1');
    expect(formatDateTime('2027-03-27T23:59:59Z', 'Europe/London')).toBe('27 Mar 2027, 23:59 GMT');
    // Eastern daylight time is UTC-4 in July (IANA tz database).
    expect(formatDateTime(new Date('2027-07-01T02:30:00Z'), 'America/New_York')).toBe('30 Jun 2027, 22:30 EDT');
  });

  it('shows an instant as the day it is in the zone, and a calendar date as itself', () => {
    // 23:30Z on 31 March is already 1 April in London (BST).
    expect(formatDate('2027-03-31T23:30:00Z', 'Europe/London')).toBe('1 Apr 2027');
    expect(formatDate('2027-03-31T23:30:00Z', 'UTC')).toBe('31 Mar 2027');
    expect(formatDate('2027-04-01', 'Pacific/Honolulu')).toBe('1 Apr 2027');
    expect(formatDate('not a date', 'UTC')).toBe('not a date');
  });

  it('reads today and an instant’s date in the zone', () => {
    const now = new Date('2027-03-31T12:30:00Z'); // 01:30 on 1 April in Auckland (NZDT, UTC+13)
    expect(localToday('Pacific/Auckland', now)).toBe('2027-04-01');
    expect(localToday('Europe/London', now)).toBe('2027-03-31');
    expect(localDateOf('2027-03-28T23:30:00Z', 'Europe/London')).toBe('2027-03-29');
    expect(addCalendarDays('2027-03-20', 14)).toBe('2027-04-03');
  });
});

describe('suggestRenewalDeadline', () => {
  it('is the club’s days from today for a first season', () => {
    // computed: 2 Dec 2026 + 14 days = 16 Dec 2026
    expect(suggestRenewalDeadline({ today: '2026-12-02', renewalDays: 14, previousDeadline: null })).toBe('2026-12-16');
  });
  it('never falls on or before the previous season’s deadline', () => {
    // The 2027 round closes on 15 Jan 2027; opening 2028 on 2 Dec 2026 must not suggest 16 Dec 2026.
    // computed: the same day a year on, 15 Jan 2028, is the later of the two.
    expect(suggestRenewalDeadline({ today: '2026-12-02', renewalDays: 14, previousDeadline: '2027-01-15' })).toBe('2028-01-15');
  });
  it('keeps the round’s time of year when that is later than the club’s days from today', () => {
    // computed: 2 Dec 2027 + 14 days = 16 Dec 2027, before 10 Jan 2028 (10 Jan 2027 a year on)
    expect(suggestRenewalDeadline({ today: '2027-12-02', renewalDays: 14, previousDeadline: '2027-01-10' })).toBe('2028-01-10');
    // computed: 2 Dec 2027 + 14 days = 16 Dec 2027, after 1 Dec 2027 (1 Dec 2026 a year on)
    expect(suggestRenewalDeadline({ today: '2027-12-02', renewalDays: 14, previousDeadline: '2026-12-01' })).toBe('2027-12-16');
  });
  it('takes 28 February after a 29 February deadline', () => {
    expect(suggestRenewalDeadline({ today: '2028-01-01', renewalDays: 14, previousDeadline: '2028-02-29' })).toBe('2029-02-28');
  });
});
