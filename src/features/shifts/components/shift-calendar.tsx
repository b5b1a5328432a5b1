import { useEffect, useMemo, useRef, type KeyboardEvent, type SyntheticEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Calendar, dateFnsLocalizer, type AgendaTimeProps, type EventProps, type Formats, type Messages, type View } from 'react-big-calendar';
import { format, getDay, parse, startOfWeek } from 'date-fns';
import { enGB } from 'date-fns/locale';
import { ChevronLeft, ChevronRight } from 'lucide-react';
import { zoneName } from '@shared/dates';
import type { Shift } from '@shared/schemas/shifts';
import { Button } from '@/components/ui/button';
import { paths } from '@/lib/paths';
import { AGENDA_DAYS, calendarRange, calendarViews, eventClassName, floatingDate, isoOfLocal, localMidnight, stepAnchor, toCalendarEvent, type CalendarView, type ShiftEvent } from '../lib/calendar';
import { rangeLabel, shiftTimes } from '../lib/dates';
import './shift-calendar.css';

// date-fns's own startOfWeek, with the en-GB locale so weeks start on Monday like the list's.
const localizer = dateFnsLocalizer({ format, parse, startOfWeek, getDay, locales: { 'en-GB': enGB } });

/**
 * react-big-calendar 1.20 marks its month and week grids up as ARIA tables whose rows also hold the
 * event buttons, which axe rightly reports (aria-required-children and -parent). The grids are a
 * picture of the dates here (the list view and the agenda carry the same shifts as text), so their
 * table roles are taken away and the events stay buttons and links inside a labelled group.
 */
function useFlatCalendarGrid() {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const root = ref.current;
    if (!root) return;
    const flatten = () => {
      for (const grid of root.querySelectorAll<HTMLElement>(':is(.rbc-month-view, .rbc-time-view)[role="table"]')) grid.setAttribute('role', 'group');
      for (const el of root.querySelectorAll<HTMLElement>(
        ':is(.rbc-month-view, .rbc-time-view) :is([role="table"], [role="row"], [role="rowgroup"], [role="cell"], [role="columnheader"], [role="gridcell"])',
      )) {
        el.setAttribute('role', 'presentation');
      }
      // Its weekday headings carry aria-sort, which only a column header may have.
      for (const el of root.querySelectorAll<HTMLElement>(':is(.rbc-month-view, .rbc-time-view) [aria-sort]')) el.removeAttribute('aria-sort');
    };
    flatten();
    const observer = new MutationObserver(flatten);
    observer.observe(root, { subtree: true, childList: true, attributes: true, attributeFilter: ['role', 'aria-sort'] });
    return () => observer.disconnect();
  }, []);
  return ref;
}

const clock = (d: Date) => format(d, 'HH:mm');
const span = ({ start, end }: { start: Date; end: Date }) => `${clock(start)}–${clock(end)}`;
const formats: Formats = {
  dateFormat: 'd',
  dayFormat: 'EEE d',
  weekdayFormat: 'EEE',
  timeGutterFormat: 'HH:mm',
  monthHeaderFormat: 'MMMM yyyy',
  dayHeaderFormat: 'EEEE d MMMM',
  dayRangeHeaderFormat: ({ start, end }) => rangeLabel(isoOfLocal(start), isoOfLocal(end)),
  agendaHeaderFormat: ({ start, end }) => rangeLabel(isoOfLocal(start), isoOfLocal(end)),
  agendaDateFormat: 'EEE d MMM',
  agendaTimeFormat: 'HH:mm',
  agendaTimeRangeFormat: span,
  eventTimeRangeFormat: span,
  eventTimeRangeStartFormat: ({ start }) => `${clock(start)} –`,
  eventTimeRangeEndFormat: ({ end }) => `– ${clock(end)}`,
  selectRangeFormat: span,
};

const messages: Messages<BoardEvent> = {
  date: 'Date',
  time: 'Time',
  event: 'Shift',
  allDay: 'All day',
  month: 'Month',
  week: 'Week',
  agenda: 'List',
  previous: 'Back',
  next: 'Next',
  today: 'Today',
  noEventsInRange: 'No shifts in these dates.',
  showMore: (count) => `+${count} more`,
};

type BoardEvent = ShiftEvent<Shift> & { href: string };

/** A month or agenda event as a link to its shift, so it opens from the keyboard too. */
function EventLink({ event }: EventProps<BoardEvent>) {
  return (
    <Link to={event.href} className="shift-event-link">
      {event.title}
    </Link>
  );
}

/** The agenda's time cell: the shift's hours on its site's clock, with the zone's name. */
function AgendaTime({ event }: AgendaTimeProps) {
  return <>{shiftTimes((event as BoardEvent).shift)}</>;
}

const viewWords: Record<CalendarView, string> = { month: 'Month', week: 'Week', agenda: 'Agenda' };

export interface ShiftCalendarProps {
  shifts: Shift[];
  view: CalendarView;
  /** The date the view is around (YYYY-MM-DD). */
  date: string;
  /** The club's today. */
  today: string;
  timeZone: string;
  clubId: number;
  onChange: (next: { date?: string; cal?: CalendarView }) => void;
}

function label(view: CalendarView, date: string): string {
  if (view === 'month') return format(localMidnight(date), 'MMMM yyyy');
  const { from, to } = calendarRange(view, date);
  return rangeLabel(from, to);
}

/**
 * The shifts on a month, week or agenda calendar (react-big-calendar), each on its site's clock,
 * coloured by state from the palette with the state's word first in its title. Choosing one opens it.
 */
export function ShiftCalendar({ shifts, view, date, today, timeZone, clubId, onChange }: ShiftCalendarProps) {
  const navigate = useNavigate();
  const gridRef = useFlatCalendarGrid();
  const events = useMemo<BoardEvent[]>(
    () =>
      shifts.map((s) => {
        const e = toCalendarEvent(s);
        // A site in another zone than the club's says whose clock its times are on.
        const other = s.timeZone !== timeZone ? ` (times in ${zoneName(s.timeZone, new Date(s.startsAt))})` : '';
        return { ...e, title: `${e.title}${other}`, href: paths.shift(clubId, s.id) };
      }),
    [shifts, clubId, timeZone],
  );

  // An event's own link (month and agenda) opens the shift; the week's events are buttons and open it here.
  const open = (event: BoardEvent, e: SyntheticEvent) => {
    if (e.target instanceof Element && e.target.closest('a')) return;
    navigate(event.href);
  };
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <div className="flex flex-col gap-3 sm:flex-row sm:items-center sm:justify-between">
        <nav aria-label="Calendar dates" className="flex flex-wrap items-center gap-2">
          <Button variant="secondary" className="px-3" onClick={() => onChange({ date: stepAnchor(view, date, -1) })} aria-label={`Previous ${view === 'agenda' ? `${AGENDA_DAYS} days` : view}`}>
            <ChevronLeft className="size-5" aria-hidden="true" />
          </Button>
          <Button variant="secondary" onClick={() => onChange({ date: today })}>
            Today
          </Button>
          <Button variant="secondary" className="px-3" onClick={() => onChange({ date: stepAnchor(view, date, 1) })} aria-label={`Next ${view === 'agenda' ? `${AGENDA_DAYS} days` : view}`}>
            <ChevronRight className="size-5" aria-hidden="true" />
          </Button>
          <p className="ml-1 font-semibold" aria-live="polite">
            {label(view, date)}
          </p>
        </nav>
        <div role="group" aria-label="Calendar view" className="flex gap-2">
          {calendarViews.map((v) => (
            <Button key={v} variant={v === view ? 'primary' : 'secondary'} aria-pressed={v === view} className="flex-1 sm:flex-none" onClick={() => onChange({ cal: v })}>
              {viewWords[v]}
            </Button>
          ))}
        </div>
      </div>
      <div ref={gridRef} className={`shift-calendar ${view === 'agenda' ? '' : 'h-[36rem] sm:h-[44rem]'}`}>
        <Calendar<BoardEvent>
          localizer={localizer}
          culture="en-GB"
          events={events}
          toolbar={false}
          views={[...calendarViews] as View[]}
          view={view}
          date={localMidnight(date)}
          length={AGENDA_DAYS}
          // "Today" and the week's now-line are the club's, not the reader's machine's.
          getNow={() => floatingDate(new Date().toISOString(), timeZone)}
          onView={(v) => onChange({ cal: calendarViews.find((c) => c === v) ?? 'month' })}
          onNavigate={(d) => onChange({ date: isoOfLocal(d) })}
          drilldownView="week"
          onSelectEvent={open}
          onKeyPressEvent={(event, e) => {
            // The week view's events are role="button": Enter and Space open them, as a button's would.
            const key = (e as KeyboardEvent<HTMLElement>).key;
            if (key === 'Enter' || key === ' ') open(event, e);
          }}
          eventPropGetter={(event) => ({ className: eventClassName(event.shift.state) })}
          components={{ month: { event: EventLink }, agenda: { event: EventLink, time: AgendaTime } }}
          formats={formats}
          messages={messages}
          scrollToTime={new Date(1970, 0, 1, 7, 0)}
          popup
        />
      </div>
    </div>
  );
}
