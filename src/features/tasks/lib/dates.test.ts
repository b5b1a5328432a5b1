import { describe, expect, it } from 'vitest';
import { addDaysTo, daysBetween, dueWords, isCalendarDate, shortDate, taskDate, taskWindow, taskWindowWords } from './dates';

describe('taskDate', () => {
  it('names the weekday of a calendar date, en-GB style', () => {
    // 9 June 2026 is a Tuesday (Gregorian calendar; 1 January 2026 is a Thursday, +159 days).
    expect(taskDate('2026-06-09', '2026-06-01')).toBe('Tue 9 Jun');
    expect(taskDate('2026-06-14', '2026-06-01')).toBe('Sun 14 Jun');
  });
  it('adds the year when the date is not in this year', () => {
    // 4 January 2027 is a Monday (Gregorian calendar).
    expect(taskDate('2027-01-04', '2026-12-30')).toBe('Mon 4 Jan 2027');
  });
  it('never shifts a day whatever zone the reader is in', () => {
    // Calendar dates are read as UTC days; a zone far west of UTC would move a parsed midnight to the day before.
    expect(taskDate('2026-03-29', '2026-01-01')).toBe('Sun 29 Mar');
  });
  it('gives back what it cannot read', () => {
    expect(taskDate('2026-02-30', '2026-01-01')).toBe('2026-02-30');
    expect(isCalendarDate('2026-02-30')).toBe(false);
    expect(isCalendarDate('2028-02-29')).toBe(true);
  });
});

describe('taskWindow', () => {
  it('reads as two plain dates with a dash', () => {
    expect(taskWindow('2026-06-09', '2026-06-14', '2026-06-08')).toBe('Tue 9 Jun – Sun 14 Jun');
    expect(taskWindowWords('2026-06-09', '2026-06-14', '2026-06-08')).toBe('Tue 9 Jun to Sun 14 Jun');
  });
  it('is one date for a one-day window', () => {
    expect(taskWindow('2026-06-09', '2026-06-09', '2026-06-08')).toBe('Tue 9 Jun');
  });
  it('names both years across the new year', () => {
    // 30 December 2026 is a Wednesday, 2 January 2027 a Saturday (Gregorian calendar).
    expect(taskWindow('2026-12-30', '2027-01-02', '2026-12-28')).toBe('Wed 30 Dec 2026 – Sat 2 Jan 2027');
  });
});

describe('day arithmetic', () => {
  it('adds and counts calendar days across month ends and daylight-saving changes', () => {
    expect(addDaysTo('2026-06-28', 7)).toBe('2026-07-05');
    // 29 March 2026 is the day the UK's clocks go forward; calendar days do not notice.
    expect(addDaysTo('2026-03-28', 2)).toBe('2026-03-30');
    expect(daysBetween('2026-06-09', '2026-06-14')).toBe(5);
    expect(daysBetween('2026-06-14', '2026-06-09')).toBe(-5);
  });
  it('says when a task is due relative to the site’s today', () => {
    expect(dueWords('2026-06-09', '2026-06-09')).toBe('Due today');
    expect(dueWords('2026-06-10', '2026-06-09')).toBe('Due tomorrow');
    expect(dueWords('2026-06-12', '2026-06-09')).toBe('Due in 3 days');
    expect(dueWords('2026-06-08', '2026-06-09')).toBe('1 day overdue');
    expect(dueWords('2026-06-05', '2026-06-09')).toBe('4 days overdue');
  });
  it('shortens a week start for a chart axis', () => {
    expect(shortDate('2026-06-08')).toBe('8 Jun');
  });
});
