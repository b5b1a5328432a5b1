import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import { addCalendarDays } from '@shared/dates';
import type { ShiftState } from '@shared/schemas/shifts';
import { weekStartOf } from './dates';
import { stateWords } from './words';

// react-big-calendar draws Date objects on the browser's own clock. A shift's times belong to its
// site's zone, so each event carries "floating" dates: the browser-local Date whose wall clock reads
// what the site's clock reads (18:00 at the site shows at 18:00 on the calendar, wherever the reader is).

export const calendarViews = ['month', 'week', 'agenda'] as const;
export type CalendarView = (typeof calendarViews)[number];

/** How many days the agenda lists from its first date (react-big-calendar's `length` prop). */
export const AGENDA_DAYS = 30;

/** A browser-local Date whose wall clock equals the instant's wall clock in `timeZone`. */
export function floatingDate(instant: string, timeZone: string): Date {
  const there = new TZDate(new Date(instant).getTime(), timeZone);
  return new Date(there.getFullYear(), there.getMonth(), there.getDate(), there.getHours(), there.getMinutes(), 0, 0);
}

/** A browser-local midnight of a calendar date (the calendar's `date`, which it reads on the local clock). */
export function localMidnight(iso: string): Date {
  const [y, m, d] = iso.split('-').map(Number);
  return new Date(y, m - 1, d);
}

/** The calendar date a browser-local Date shows (the inverse of localMidnight). */
export function isoOfLocal(date: Date): string {
  return format(date, 'yyyy-MM-dd');
}

/** What an event needs of a shift. */
export type CalendarShift = { id: number; title: string; state: ShiftState; startsAt: string; endsAt: string; timeZone: string; siteName: string };

export interface ShiftEvent<S extends CalendarShift = CalendarShift> {
  id: number;
  /** The state's word comes first, so the event never says its state by colour alone. */
  title: string;
  start: Date;
  end: Date;
  shift: S;
}

/** A shift as a calendar event, on its site's clock. */
export function toCalendarEvent<S extends CalendarShift>(shift: S): ShiftEvent<S> {
  return {
    id: shift.id,
    title: `${stateWords[shift.state]}: ${shift.title} · ${shift.siteName}`,
    start: floatingDate(shift.startsAt, shift.timeZone),
    end: floatingDate(shift.endsAt, shift.timeZone),
    shift,
  };
}

/** The class an event gets for its state; the colours are set in shift-calendar.css from the palette. */
export function eventClassName(state: ShiftState): string {
  return `shift-event shift-event-${state.replace('_', '-')}`;
}

/**
 * The dates the board asks the server for to fill a calendar view around `anchor`: the weeks the
 * month grid shows (Monday to Sunday, the 1st's week to the last day's week), the week, or the
 * agenda's days.
 */
export function calendarRange(view: CalendarView, anchor: string): { from: string; to: string } {
  if (view === 'week') {
    const from = weekStartOf(anchor);
    return { from, to: addCalendarDays(from, 6) };
  }
  if (view === 'agenda') return { from: anchor, to: addCalendarDays(anchor, AGENDA_DAYS) };
  const first = `${anchor.slice(0, 7)}-01`;
  const last = addCalendarDays(`${nextMonth(anchor)}-01`, -1);
  return { from: weekStartOf(first), to: addCalendarDays(weekStartOf(last), 6) };
}

/** "2026-08" for any date in July 2026. */
function nextMonth(iso: string): string {
  const [y, m] = iso.split('-').map(Number);
  return m === 12 ? `${y + 1}-01` : `${y}-${String(m + 1).padStart(2, '0')}`;
}

/** The anchor after moving a view one step back or forward: a month, a week or an agenda's length. */
export function stepAnchor(view: CalendarView, anchor: string, direction: -1 | 1): string {
  if (view === 'week') return addCalendarDays(anchor, 7 * direction);
  if (view === 'agenda') return addCalendarDays(anchor, AGENDA_DAYS * direction);
  const [y, m] = anchor.split('-').map(Number);
  const index = y * 12 + (m - 1) + direction;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}-01`;
}
