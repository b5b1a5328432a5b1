import { localDateOf } from '@shared/dates';
import type { ClaimStatus, ShiftState } from '@shared/schemas/shifts';

/** What the buttons need of a shift. */
export type ActionShift = {
  state: ShiftState;
  date: string;
  startsAt: string;
  endsAt: string;
  timeZone: string;
  capacity: number;
  taken: number;
  myClaim: { id: number; status: ClaimStatus } | null;
};

export interface ShiftActions {
  claim: boolean;
  release: boolean;
  done: boolean;
  /** Why there is no button to take a place, when the person could otherwise take one. */
  note: string | null;
}

/**
 * Which buttons a person sees on a shift. Taking a place: volunteers and coordinators, while places
 * are left and the shift has not ended. Giving it back: their own place, until the shift starts.
 * Marking done: their own place, from the shift's day (on the site's calendar) until they have.
 * The server decides in the end; these only keep buttons that cannot work off the page.
 */
export function shiftActions(shift: ActionShift, { canClaim, now = new Date() }: { canClaim: boolean; now?: Date }): ShiftActions {
  const mine = shift.myClaim?.status === 'taken';
  const ended = now.getTime() >= Date.parse(shift.endsAt);
  const started = now.getTime() >= Date.parse(shift.startsAt);
  const onOrAfterDay = localDateOf(now, shift.timeZone) >= shift.date;
  const calledOff = shift.state === 'called_off';
  const full = shift.taken >= shift.capacity;

  const claim = canClaim && !calledOff && !mine && shift.myClaim?.status !== 'done' && !ended && !full && shift.state === 'needs_people';
  const release = mine && !calledOff && !started;
  const done = mine && !calledOff && onOrAfterDay;

  let note: string | null = null;
  if (canClaim && !mine && shift.myClaim?.status !== 'done') {
    if (calledOff) note = 'This shift is called off.';
    else if (ended || shift.state === 'not_done') note = 'This shift is over.';
    else if (shift.state === 'done') note = 'This shift is done.';
    else if (full || shift.state === 'covered') note = 'Every place is taken.';
  }
  return { claim, release, done, note };
}

export interface CoordinatorActions {
  edit: boolean;
  askForHelp: boolean;
  callOff: boolean;
}

/**
 * What a coordinator may do to a shift: edit it while it still stands (needs people or covered, a past
 * one too, to correct it); ask for help by e-mail while it needs people and has not ended; call it off
 * until it ends.
 */
export function coordinatorActions(shift: Pick<ActionShift, 'state' | 'endsAt'>, now: Date = new Date()): CoordinatorActions {
  const stands = shift.state === 'needs_people' || shift.state === 'covered';
  const ahead = stands && now.getTime() < Date.parse(shift.endsAt);
  return { edit: stands, askForHelp: ahead && shift.state === 'needs_people', callOff: ahead };
}
