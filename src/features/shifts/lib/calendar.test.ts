import { afterEach, describe, expect, it } from 'vitest';
import { shiftStates } from '@shared/schemas/shifts';
import { AGENDA_DAYS, calendarRange, eventClassName, floatingDate, isoOfLocal, localMidnight, stepAnchor, toCalendarEvent } from './calendar';

const shift = {
  id: 7,
  title: 'Evening watering',
  siteName: 'Riverside',
  state: 'needs_people' as const,
  // 22:00 UTC is 18:00 in New York in July (EDT, UTC−4); 00:00 UTC next day is 20:00 EDT.
  startsAt: '2026-07-14T22:00:00Z',
  endsAt: '2026-07-15T00:00:00Z',
  timeZone: 'America/New_York',
};

describe('calendar events on the site’s clock', () => {
  const machineZone = process.env.TZ;
  afterEach(() => {
    if (machineZone === undefined) delete process.env.TZ;
    else process.env.TZ = machineZone;
  });

  it('puts the site’s wall clock on the event, whatever zone the browser is in', () => {
    // Node reads process.env.TZ again when it changes (Node.js docs, "process.env.TZ"), so this runs the
    // mapping as a browser in Tokyo and one in London would.
    for (const zone of ['Asia/Tokyo', 'Europe/London', 'UTC']) {
      process.env.TZ = zone;
      const e = toCalendarEvent(shift);
      expect([e.start.getFullYear(), e.start.getMonth(), e.start.getDate(), e.start.getHours(), e.start.getMinutes()]).toEqual([2026, 6, 14, 18, 0]);
      expect([e.end.getDate(), e.end.getHours()]).toEqual([14, 20]);
    }
  });

  it('puts the state’s word first in the title, and the site after it', () => {
    expect(toCalendarEvent(shift).title).toBe('Needs people: Evening watering · Riverside');
    expect(toCalendarEvent({ ...shift, state: 'called_off' }).title).toBe('Called off: Evening watering · Riverside');
    expect(toCalendarEvent(shift).shift).toBe(shift);
    expect(toCalendarEvent(shift).id).toBe(7);
  });

  it('gives each state its own class, for the palette colours in the stylesheet', () => {
    const classes = shiftStates.map(eventClassName);
    expect(new Set(classes).size).toBe(shiftStates.length);
    expect(eventClassName('needs_people')).toBe('shift-event shift-event-needs-people');
    expect(eventClassName('not_done')).toBe('shift-event shift-event-not-done');
  });

  it('keeps a floating date’s minutes and turns a calendar date into a local midnight and back', () => {
    // 09:45 UTC is 10:45 in Lisbon in summer (WEST, UTC+1).
    const d = floatingDate('2026-06-01T09:45:00Z', 'Europe/Lisbon');
    expect([d.getHours(), d.getMinutes()]).toEqual([10, 45]);
    expect(isoOfLocal(localMidnight('2026-02-28'))).toBe('2026-02-28');
    expect(localMidnight('2026-07-06').getHours()).toBe(0);
  });
});

describe('the dates a calendar view asks for', () => {
  it('covers the month grid’s whole weeks, Monday to Sunday', () => {
    // July 2026: the 1st is a Wednesday (week from Mon 29 June), the 31st a Friday (week to Sun 2 August).
    expect(calendarRange('month', '2026-07-15')).toEqual({ from: '2026-06-29', to: '2026-08-02' });
    // February 2027: the 1st is a Monday and the 28th a Sunday, so exactly four weeks.
    expect(calendarRange('month', '2027-02-10')).toEqual({ from: '2027-02-01', to: '2027-02-28' });
    // December 2026 runs into January 2027: the 31st is a Thursday, its week ends Sunday 3 January.
    expect(calendarRange('month', '2026-12-01')).toEqual({ from: '2026-11-30', to: '2027-01-03' });
  });

  it('covers the week, or the agenda’s days from the date', () => {
    expect(calendarRange('week', '2026-07-08')).toEqual({ from: '2026-07-06', to: '2026-07-12' });
    expect(AGENDA_DAYS).toBe(30);
    // computed: 14 July + 30 days = 13 August
    expect(calendarRange('agenda', '2026-07-14')).toEqual({ from: '2026-07-14', to: '2026-08-13' });
  });

  it('never asks for more than the server’s 92 days at a time', () => {
    for (const view of ['month', 'week', 'agenda'] as const) {
      const { from, to } = calendarRange(view, '2026-12-31');
      expect((Date.parse(to) - Date.parse(from)) / 86_400_000).toBeLessThanOrEqual(92);
    }
  });

  it('steps a month, a week or an agenda at a time', () => {
    expect(stepAnchor('month', '2026-12-15', 1)).toBe('2027-01-01');
    expect(stepAnchor('month', '2026-01-31', -1)).toBe('2025-12-01');
    expect(stepAnchor('week', '2026-07-08', -1)).toBe('2026-07-01');
    expect(stepAnchor('agenda', '2026-07-14', 1)).toBe('2026-08-13');
  });
});
