import { describe, expect, it } from 'vitest';
import { coordinatorActions, shiftActions, type ActionShift } from './actions';

// A London shift on Tuesday 14 July 2026 from 18:00 to 20:00 BST (17:00–19:00 UTC).
const base: ActionShift = {
  state: 'needs_people',
  date: '2026-07-14',
  startsAt: '2026-07-14T17:00:00Z',
  endsAt: '2026-07-14T19:00:00Z',
  timeZone: 'Europe/London',
  capacity: 3,
  taken: 1,
  myClaim: null,
};
const dayBefore = new Date('2026-07-13T12:00:00Z');
const morningOf = new Date('2026-07-14T08:00:00Z');
const during = new Date('2026-07-14T18:00:00Z');
const after = new Date('2026-07-14T20:00:00Z');
const mine = { id: 1, status: 'taken' as const };

describe('which buttons a shift shows', () => {
  it('offers a place while there are places and the shift has not ended', () => {
    expect(shiftActions(base, { canClaim: true, now: dayBefore })).toEqual({ claim: true, release: false, done: false, note: null });
    expect(shiftActions(base, { canClaim: true, now: during }).claim).toBe(true);
    expect(shiftActions(base, { canClaim: true, now: after })).toMatchObject({ claim: false, note: 'This shift is over.' });
  });

  it('offers nothing to someone who may not take places (a plot holder only)', () => {
    expect(shiftActions(base, { canClaim: false, now: dayBefore })).toEqual({ claim: false, release: false, done: false, note: null });
  });

  it('says so when every place is taken or the shift is called off', () => {
    expect(shiftActions({ ...base, state: 'covered', taken: 3 }, { canClaim: true, now: dayBefore })).toMatchObject({ claim: false, note: 'Every place is taken.' });
    expect(shiftActions({ ...base, state: 'called_off' }, { canClaim: true, now: dayBefore })).toMatchObject({ claim: false, note: 'This shift is called off.' });
    // Someone marked it done before its end: no place to take, and the note says why.
    expect(shiftActions({ ...base, state: 'done', taken: 3 }, { canClaim: true, now: during })).toMatchObject({ claim: false, note: 'This shift is done.' });
  });

  it('lets the person give their place back until the shift starts, and mark it done from its day', () => {
    const taken = { ...base, myClaim: mine };
    expect(shiftActions(taken, { canClaim: true, now: dayBefore })).toEqual({ claim: false, release: true, done: false, note: null });
    // On the morning of the shift both: they may have done it early, or find they cannot come.
    expect(shiftActions(taken, { canClaim: true, now: morningOf })).toEqual({ claim: false, release: true, done: true, note: null });
    expect(shiftActions(taken, { canClaim: true, now: during })).toEqual({ claim: false, release: false, done: true, note: null });
    expect(shiftActions(taken, { canClaim: true, now: after })).toMatchObject({ release: false, done: true });
  });

  it('reads the shift’s day on the site’s calendar, not in UTC', () => {
    // 23:30 UTC on 13 July is already 00:30 on 14 July in London (BST): the shift's day has begun there.
    const taken = { ...base, myClaim: mine };
    expect(shiftActions(taken, { canClaim: true, now: new Date('2026-07-13T23:30:00Z') }).done).toBe(true);
    expect(shiftActions(taken, { canClaim: true, now: new Date('2026-07-13T22:30:00Z') }).done).toBe(false);
  });

  it('offers the place again after giving it back, and nothing more once done', () => {
    expect(shiftActions({ ...base, myClaim: { id: 1, status: 'released' } }, { canClaim: true, now: dayBefore }).claim).toBe(true);
    expect(shiftActions({ ...base, myClaim: { id: 1, status: 'done' } }, { canClaim: true, now: after })).toEqual({ claim: false, release: false, done: false, note: null });
  });
});

describe('what a coordinator may do to a shift', () => {
  it('asks for help only while places are left and the shift is to come; calls off until it ends', () => {
    expect(coordinatorActions(base, dayBefore)).toEqual({ edit: true, askForHelp: true, callOff: true });
    expect(coordinatorActions({ ...base, state: 'covered' }, dayBefore)).toEqual({ edit: true, askForHelp: false, callOff: true });
    expect(coordinatorActions(base, after)).toEqual({ edit: true, askForHelp: false, callOff: false });
  });

  it('leaves finished and called-off shifts alone', () => {
    for (const state of ['done', 'not_done', 'called_off'] as const) {
      expect(coordinatorActions({ ...base, state }, dayBefore)).toEqual({ edit: false, askForHelp: false, callOff: false });
    }
  });
});
