import { describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { TaskFormSchema, taskFormDefaults, type TaskFormInput } from './task-form';

// Dates near the real today: the shared schema refuses dates more than about two years ahead.
const today = localToday('UTC');
const form = (over: Partial<TaskFormInput>): TaskFormInput => ({ ...taskFormDefaults(today), title: 'Turn the compost', ...over });

/** The messages per box, or the body when the form is good. */
function check(input: TaskFormInput) {
  const r = TaskFormSchema.safeParse(input);
  if (r.success) return { body: r.data };
  return { errors: Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message])) };
}

describe('the Add a task form', () => {
  it('makes a one-off site task with a week to do it in by default', () => {
    expect(check(form({}))).toEqual({
      body: { plotId: null, kind: 'other', title: 'Turn the compost', details: '', dueOn: today, windowDays: 7, repeatEveryDays: null, repeatUntil: null },
    });
  });

  it('makes a repeating task for a plot from the boxes’ text', () => {
    const until = addCalendarDays(today, 28);
    const out = check(form({ plotId: '26', kind: 'weed', windowDays: ' 3 ', repeat: true, repeatEveryDays: '7', repeatUntil: until }));
    expect(out.body).toMatchObject({ plotId: 26, kind: 'weed', windowDays: 3, repeatEveryDays: 7, repeatUntil: until });
  });

  it('leaves the repeat boxes out when Repeat is not ticked, whatever they hold', () => {
    expect(check(form({ repeat: false, repeatEveryDays: 'often', repeatUntil: 'soon' })).body).toMatchObject({ repeatEveryDays: null, repeatUntil: null });
  });

  it('says on each box what a repeat is missing, and only there', () => {
    const out = check(form({ repeat: true, repeatEveryDays: '', repeatUntil: addCalendarDays(today, 14) }));
    expect(out.errors).toEqual({ repeatEveryDays: 'Say how many days apart' });
    expect(check(form({ repeat: true, repeatEveryDays: '7', repeatUntil: '' })).errors).toEqual({ repeatUntil: 'Give the last date it may fall on' });
  });

  it('shows every mistake at once: text for a number and an empty title together', () => {
    expect(check(form({ title: '  ', windowDays: 'a week' })).errors).toEqual({ windowDays: 'A whole number of days', title: 'Enter some text' });
  });

  it('uses the shared schema’s words for values out of range and dates the wrong way round', () => {
    expect(check(form({ windowDays: '0' })).errors).toEqual({ windowDays: 'At least 1 day' });
    expect(check(form({ repeat: true, repeatEveryDays: '91', repeatUntil: addCalendarDays(today, 100) })).errors).toEqual({ repeatEveryDays: 'At most every 90 days' });
    expect(check(form({ dueOn: addCalendarDays(today, 10), repeat: true, repeatEveryDays: '7', repeatUntil: addCalendarDays(today, 3) })).errors).toEqual({
      repeatUntil: 'Must be on or after the first date',
    });
  });
});
