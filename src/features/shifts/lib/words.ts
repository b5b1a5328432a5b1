import { shiftKinds, shiftStates, type ClaimStatus, type ShiftKind, type ShiftState } from '@shared/schemas/shifts';

/** Where a shift stands, in Tillwell's words; always shown as words beside an icon, never as a colour alone. */
export const stateWords: Record<ShiftState, string> = {
  needs_people: 'Needs people',
  covered: 'Covered',
  done: 'Done',
  not_done: 'Not done',
  called_off: 'Called off',
};

/** A longer line for each state, for the shift page and screen readers. */
export const stateExplained: Record<ShiftState, string> = {
  needs_people: 'This shift still has places for volunteers.',
  covered: 'Every place on this shift is taken.',
  done: 'Someone marked this shift done.',
  not_done: 'This shift ended without anyone marking it done.',
  called_off: 'A coordinator called this shift off.',
};

/** The states in the order the board's key lists them. */
export const stateOrder: readonly ShiftState[] = shiftStates;

/** Each kind of shift in a word or two, the same words the task lists use, plus the work day. */
export const kindWords: Record<ShiftKind, string> = {
  water: 'Watering',
  weed: 'Weeding',
  thin: 'Thinning',
  side_dress: 'Feeding',
  mulch: 'Mulching',
  scout: 'Pest check',
  harvest: 'Harvest',
  other: 'Other jobs',
  mixed: 'Work day',
};

/** The kinds in the order filters and forms list them. */
export const kindOrder: readonly ShiftKind[] = shiftKinds;

/** One person's place on a shift, in words (for coordinators' lists and "my shifts"). */
export const claimWords: Record<ClaimStatus, string> = {
  taken: 'Has a place',
  done: 'Done',
  released: 'Gave the place back',
  missed: 'Not marked done',
};

/** "2 of 3 taken": the places of a shift. */
export function placesText(taken: number, capacity: number): string {
  return `${taken} of ${capacity} taken`;
}

/** "1 place left", "3 places left", or "Every place taken" (also when more were taken than asked for). */
export function placesLeftText(taken: number, capacity: number): string {
  const left = capacity - taken;
  if (left <= 0) return 'Every place taken';
  return left === 1 ? '1 place left' : `${left} places left`;
}

/** A number with at most two decimals and no trailing zeros: 1.5, 0.25, 2. */
function shortNumber(n: number): string {
  return String(Math.round(n * 100) / 100);
}

/** "1 hour", "1.5 hours", "45 minutes" (under an hour, in whole minutes). */
export function hoursText(hours: number): string {
  if (hours > 0 && hours < 1) {
    const minutes = Math.round(hours * 60);
    return minutes === 1 ? '1 minute' : `${minutes} minutes`;
  }
  const n = shortNumber(hours);
  return n === '1' ? '1 hour' : `${n} hours`;
}

/** "About 1.5 hours" for a shift's estimate. */
export function estimateText(hours: number): string {
  return `About ${hoursText(hours)}`;
}

/** The days of the week by the number the server uses for the weekly e-mail (0 Sunday … 6 Saturday). */
export const weekdayNames = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'] as const;

/**
 * "Plots and B-2"; "Plot A-1"; null when the shift names no plot (a work day for the site).
 * Past four plots a card names three and counts the rest; `all` names every one (the shift's own page).
 */
export function plotsText(labels: readonly string[], { all = false }: { all?: boolean } = {}): string | null {
  const unique = [...new Set(labels)];
  if (unique.length === 0) return null;
  if (unique.length === 1) return `Plot ${unique[0]}`;
  if (all || unique.length <= 4) return `Plots ${unique.slice(0, -1).join(', ')} and ${unique[unique.length - 1]}`;
  return `Plots ${unique.slice(0, 3).join(', ')} and ${unique.length - 3} more`;
}
