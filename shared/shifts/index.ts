import { SAFETY_CAUTION } from '../crops/caution';
import type { TaskKind } from '../schemas/tasks';
import type { ClaimStatus, ShiftKind, ShiftState } from '../schemas/shifts';
import { HEAT_CAUTION, TOOL_CAUTION } from '../tasks/generate';
import { usGallonsFromLitres } from '../water/units';

// Shifts from open tasks: the grouping the coordinator starts from, the hours it will take, the
// usual cautions, and where a shift stands. Pure code, shared by the server and the pages.

/**
 * Minutes one task of a kind takes a volunteer, walking to the plot included. Our own estimates
 * for a first suggestion (not published figures); the coordinator edits the hours of any shift.
 */
export const MINUTES_PER_TASK: Record<TaskKind, number> = {
  water: 5,
  weed: 20,
  thin: 15,
  side_dress: 15,
  mulch: 30,
  scout: 10,
  harvest: 20,
  other: 30,
};
/** Watering adds a minute per 10 L carried or run from the hose (our own estimate). */
export const WATER_MINUTES_PER_10_L = 1;
/** Hours one person gives a shift before another place is suggested (our own figure). */
export const HOURS_PER_PERSON = 1.5;

/** When a suggested shift starts: watering in the evening, when less is lost to evaporation (common practice); the rest in the morning. */
export const DEFAULT_START: Record<'water' | 'other', string> = { water: '18:00', other: '10:00' };

export const shiftKindWords: Record<ShiftKind, string> = {
  water: 'watering',
  weed: 'weeding',
  thin: 'thinning',
  side_dress: 'side-dressing',
  mulch: 'mulching',
  scout: 'pest look-over',
  harvest: 'harvest',
  other: 'garden jobs',
  mixed: 'work day',
};

export const shiftStateWords: Record<ShiftState, string> = {
  needs_people: 'Needs people',
  covered: 'Covered',
  done: 'Done',
  not_done: 'Not done',
  called_off: 'Called off',
};

export const claimStatusWords: Record<ClaimStatus, string> = {
  taken: 'Taken',
  done: 'Done',
  released: 'Given back',
  missed: 'Not marked done',
};

const LIFTING = 'Lift with bent knees and a straight back, and share heavy loads.';

/**
 * The usual cautions for a shift's work, always shown with it: heat and carrying for watering (1 L of
 * water weighs about 1 kg), tools for weeding, thinning and harvest, labels and gloves for fertiliser
 * (side-dressing), lifting for mulch, and no spraying without the holder's say and the label's rules.
 */
export function shiftCaution(kinds: Iterable<ShiftKind>): string {
  const set = new Set(kinds);
  const parts: string[] = [];
  if (set.has('water')) parts.push(`${HEAT_CAUTION} A 10 L can of water weighs about 10 kg.`);
  if (set.has('weed') || set.has('thin') || set.has('harvest') || set.has('other') || set.has('mixed')) parts.push(TOOL_CAUTION);
  if (set.has('mulch') || set.has('mixed')) parts.push(LIFTING);
  if (set.has('side_dress')) parts.push(`Fertiliser: ${SAFETY_CAUTION}`);
  if (set.has('scout')) parts.push(`Look and note only; nothing is sprayed on a shift unless the coordinator arranged it. If anything is: ${SAFETY_CAUTION}`);
  if (!parts.length) parts.push(TOOL_CAUTION);
  parts.push('Stop and rest if you feel unwell, and tell the coordinator about any injury.');
  return parts.join(' ');
}

/** Hours a set of tasks takes one person, rounded up to a quarter of an hour, at least half an hour. */
export function estimateHours(tasks: Array<{ kind: TaskKind; amountL: number | null }>): number {
  let minutes = 0;
  for (const t of tasks) minutes += MINUTES_PER_TASK[t.kind] + (t.kind === 'water' && t.amountL ? (t.amountL / 10) * WATER_MINUTES_PER_10_L : 0);
  return Math.max(0.5, Math.ceil(minutes / 15) / 4);
}

/** Places for a shift of these hours, so nobody gives much more than HOURS_PER_PERSON. */
export function suggestCapacity(hours: number): number {
  return Math.max(1, Math.ceil(hours / HOURS_PER_PERSON - 1e-9));
}

/** "18:00" plus some hours, as "HH:mm", stopping at 23:59. */
export function addHoursToTime(time: string, hours: number): string {
  const [h, m] = time.split(':').map(Number);
  const total = Math.min(23 * 60 + 59, h * 60 + m + Math.round(hours * 60));
  return `${String(Math.floor(total / 60)).padStart(2, '0')}:${String(total % 60).padStart(2, '0')}`;
}

const labelCompare = new Intl.Collator('en', { numeric: true, sensitivity: 'base' }).compare;

/** Plot labels in words: "plot A-1", "plots and B-2", "plots A-1 to B-9 (7 plots)"; shared beds and the site say so. */
export function plotsInWords(labels: Array<string | null>): string {
  const plots = [...new Set(labels.filter((l): l is string => Boolean(l)))].sort(labelCompare);
  const shared = labels.some((l) => !l);
  const parts: string[] = [];
  if (plots.length === 1) parts.push(`plot ${plots[0]}`);
  else if (plots.length > 1 && plots.length <= 3) parts.push(`plots ${plots.slice(0, -1).join(', ')} and ${plots[plots.length - 1]}`);
  else if (plots.length > 3) parts.push(`plots ${plots[0]} to ${plots[plots.length - 1]} (${plots.length} plots)`);
  if (shared) parts.push('the shared beds');
  return parts.join(' and ');
}

const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

/** The weekday of a calendar date (the date alone, whatever the zone). */
export function weekdayOf(date: string): string {
  return WEEKDAYS[new Date(`${date}T12:00:00Z`).getUTCDay()];
}

export function partOfDay(time: string): string {
  return time < '12:00' ? 'morning' : time < '17:00' ? 'afternoon' : 'evening';
}

export interface OpenTask {
  id: number;
  siteId: number;
  kind: TaskKind;
  dueOn: string;
  plotLabel: string | null;
  amountL: number | null;
}

export interface SuggestedShift {
  siteId: number;
  kind: ShiftKind;
  date: string;
  startTime: string;
  endTime: string;
  title: string;
  taskIds: number[];
  plotLabels: string[];
  estHours: number;
  capacity: number;
  amountL: number | null;
  estimate: string;
}

/**
 * Groups open tasks by site, due date and kind into one suggested shift each: watering in the
 * evening, the rest in the morning, with the hours estimated, a place per HOURS_PER_PERSON and a
 * title such as "Tuesday evening watering, plots B-1 to B-9 (9 plots), about 180 L".
 */
export function suggestShifts(tasks: OpenTask[], opts: { units: 'metric' | 'us' | ((siteId: number) => 'metric' | 'us') } = { units: 'metric' }): SuggestedShift[] {
  const groups = new Map<string, OpenTask[]>();
  for (const t of tasks) {
    const key = `${t.siteId}|${t.dueOn}|${t.kind}`;
    const list = groups.get(key);
    if (list) list.push(t);
    else groups.set(key, [t]);
  }
  const out: SuggestedShift[] = [];
  for (const list of groups.values()) {
    const { siteId, dueOn: date, kind } = list[0];
    const estHours = estimateHours(list);
    const capacity = suggestCapacity(estHours);
    const startTime = kind === 'water' ? DEFAULT_START.water : DEFAULT_START.other;
    // Each person's share of the hours, rounded up to half an hour, sets the window (at least an hour).
    const endTime = addHoursToTime(startTime, Math.max(1, Math.ceil((estHours / capacity) * 2) / 2));
    const litres = kind === 'water' ? list.reduce((a, t) => a + (t.amountL ?? 0), 0) : null;
    const units = typeof opts.units === 'function' ? opts.units(siteId) : opts.units;
    const amount =
      litres && litres > 0 ? (units === 'us' ? `, about ${Math.round(usGallonsFromLitres(litres))} US gal` : `, about ${Math.round(litres / 10) * 10 || Math.round(litres)} L`) : '';
    const labels = list.map((t) => t.plotLabel);
    const minutes = list.length === 1 ? '1 task' : `${list.length} tasks`;
    out.push({
      siteId,
      kind,
      date,
      startTime,
      endTime,
      title: `${weekdayOf(date)} ${partOfDay(startTime)} ${shiftKindWords[kind]}, ${plotsInWords(labels)}${amount}`,
      taskIds: list.map((t) => t.id).sort((a, b) => a - b),
      plotLabels: [...new Set(labels.filter((l): l is string => Boolean(l)))].sort(labelCompare),
      estHours,
      capacity,
      amountL: litres,
      estimate: `${minutes} at about ${MINUTES_PER_TASK[kind]} minutes each${kind === 'water' ? ', plus a minute for every 10 L' : ''} (our own estimate): ${estHours} h, ${capacity} ${capacity === 1 ? 'place' : 'places'} of up to ${HOURS_PER_PERSON} h`,
    });
  }
  return out.sort((a, b) => a.date.localeCompare(b.date) || a.startTime.localeCompare(b.startTime) || a.siteId - b.siteId || a.kind.localeCompare(b.kind));
}

/** Where a shift stands at `now`, from its places and its time. */
export function shiftState(s: { calledOff: boolean; endsAt: Date; capacity: number }, claims: Array<{ status: ClaimStatus }>, now: Date): ShiftState {
  if (s.calledOff) return 'called_off';
  if (claims.some((c) => c.status === 'done')) return 'done';
  if (now >= s.endsAt) return 'not_done';
  const taken = claims.filter((c) => c.status === 'taken').length;
  return taken >= s.capacity ? 'covered' : 'needs_people';
}
