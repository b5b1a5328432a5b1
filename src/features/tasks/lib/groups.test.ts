import { describe, expect, it } from 'vitest';
import type { PlotTasks, TaskView } from '@shared/schemas/tasks';
import { handedOverOn, nothingToDo, openThisWeek, taskGroups } from './groups';

let nextId = 1;
function task(over: Partial<TaskView>): TaskView {
  return {
    id: nextId++,
    siteId: 1,
    plotId: 10,
    plotLabel: 'A-1',
    plantingId: 5,
    cropName: 'Lettuce',
    kind: 'water',
    origin: 'generated',
    title: 'Water the lettuce',
    details: 'Need 20 mm, rain 8 mm, deficit 12 mm.',
    source: 'FAO-56',
    caution: null,
    dueOn: '2026-06-10',
    windowFrom: '2026-06-09',
    windowTo: '2026-06-14',
    amountMm: 12,
    amountL: 36,
    status: 'open',
    forVolunteers: false,
    doneOn: null,
    version: 1,
    ...over,
  };
}

const empty: Pick<PlotTasks, 'overdue' | 'thisWeek' | 'nextWeek' | 'later' | 'recentlyDone'> = {
  overdue: [],
  thisWeek: [],
  nextWeek: [],
  later: [],
  recentlyDone: [],
};

describe('taskGroups', () => {
  it('keeps the panel order, leaves out empty groups and folds Later', () => {
    const groups = taskGroups({
      ...empty,
      later: [task({ dueOn: '2026-07-01' })],
      overdue: [task({ dueOn: '2026-06-01' })],
      recentlyDone: [task({ status: 'done', doneOn: '2026-06-08' })],
    });
    expect(groups.map((g) => g.title)).toEqual(['Overdue', 'Later', 'Recently done']);
    expect(groups.map((g) => g.collapsed)).toEqual([false, true, false]);
  });

  it('sorts open tasks soonest first, then by kind within a day', () => {
    const weed = task({ kind: 'weed', title: 'Hoe between rows', dueOn: '2026-06-11' });
    const water = task({ kind: 'water', dueOn: '2026-06-11' });
    const early = task({ kind: 'harvest', dueOn: '2026-06-09' });
    const [week] = taskGroups({ ...empty, thisWeek: [weed, water, early] });
    expect(week.tasks.map((t) => t.id)).toEqual([early.id, water.id, weed.id]);
  });

  it('lists recently done newest first', () => {
    const older = task({ status: 'done', doneOn: '2026-06-02' });
    const newer = task({ status: 'done', doneOn: '2026-06-07' });
    const skipped = task({ status: 'skipped', doneOn: null, dueOn: '2026-06-05' });
    const [done] = taskGroups({ ...empty, recentlyDone: [older, skipped, newer] });
    expect(done.tasks.map((t) => t.id)).toEqual([newer.id, skipped.id, older.id]);
  });

  it('does not reorder the answer it was given', () => {
    const list = [task({ dueOn: '2026-06-12' }), task({ dueOn: '2026-06-10' })];
    const ids = list.map((t) => t.id);
    taskGroups({ ...empty, thisWeek: list });
    expect(list.map((t) => t.id)).toEqual(ids);
  });
});

describe('openThisWeek and nothingToDo', () => {
  it('counts only open tasks overdue or due this week', () => {
    const data = {
      ...empty,
      overdue: [task({}), task({ status: 'skipped' })],
      thisWeek: [task({}), task({ status: 'done', doneOn: '2026-06-09' }), task({})],
      nextWeek: [task({})],
    };
    // computed: 1 open overdue + 2 open this week = 3 (next week not counted)
    expect(openThisWeek(data)).toBe(3);
    expect(nothingToDo(data)).toBe(false);
  });
  it('is clear when every listed task is finished', () => {
    expect(nothingToDo({ ...empty, later: [task({ status: 'skipped' })] })).toBe(true);
    expect(openThisWeek(empty)).toBe(0);
  });
});

describe('handedOverOn', () => {
  const handovers = [{ id: 1, fromOn: '2026-06-10', toOn: '2026-06-20', kinds: ['water' as const], note: '' }];
  it('includes both ends of the period', () => {
    expect(handedOverOn('2026-06-10', handovers)).toBe(true);
    expect(handedOverOn('2026-06-20', handovers)).toBe(true);
    expect(handedOverOn('2026-06-21', handovers)).toBe(false);
    expect(handedOverOn('2026-06-09', handovers)).toBe(false);
  });
});
