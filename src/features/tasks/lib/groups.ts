import type { PlotTasks, TaskView } from '@shared/schemas/tasks';
import { kindOrder } from './words';

export type GroupKey = 'overdue' | 'thisWeek' | 'nextWeek' | 'later' | 'recentlyDone';

export interface TaskGroup {
  key: GroupKey;
  title: string;
  tasks: TaskView[];
  /** Shown folded until opened (Later). */
  collapsed: boolean;
}

const groupTitles: Record<GroupKey, string> = {
  overdue: 'Overdue',
  thisWeek: 'This week',
  nextWeek: 'Next week',
  later: 'Later',
  recentlyDone: 'Recently done',
};

const groupOrder: readonly GroupKey[] = ['overdue', 'thisWeek', 'nextWeek', 'later', 'recentlyDone'];

/** Open tasks soonest first: by due date, then the window's end, then kind, then title, then id. */
export function compareOpen(a: TaskView, b: TaskView): number {
  return (
    a.dueOn.localeCompare(b.dueOn) ||
    a.windowTo.localeCompare(b.windowTo) ||
    kindOrder.indexOf(a.kind) - kindOrder.indexOf(b.kind) ||
    a.title.localeCompare(b.title) ||
    a.id - b.id
  );
}

/** Finished tasks newest first: by the day done (or the due date of a skipped one), then id. */
export function compareFinished(a: TaskView, b: TaskView): number {
  return (b.doneOn ?? b.dueOn).localeCompare(a.doneOn ?? a.dueOn) || b.id - a.id;
}

/**
 * The plot book panel's groups in reading order (Overdue, This week, Next week, Later, Recently done), each
 * sorted, leaving out the empty ones; Later starts folded.
 */
export function taskGroups(data: Pick<PlotTasks, GroupKey>): TaskGroup[] {
  return groupOrder
    .map((key) => ({
      key,
      title: groupTitles[key],
      tasks: [...data[key]].sort(key === 'recentlyDone' ? compareFinished : compareOpen),
      collapsed: key === 'later',
    }))
    .filter((g) => g.tasks.length > 0);
}

/** How many tasks are still to do now: the open ones overdue or due this week (what the home page's "This week" counts). */
export function openThisWeek(data: Pick<PlotTasks, 'overdue' | 'thisWeek'>): number {
  return [...data.overdue, ...data.thisWeek].filter((t) => t.status === 'open').length;
}

/** Whether nothing is waiting: no open task overdue, this week, next week or later. */
export function nothingToDo(data: Pick<PlotTasks, 'overdue' | 'thisWeek' | 'nextWeek' | 'later'>): boolean {
  return [...data.overdue, ...data.thisWeek, ...data.nextWeek, ...data.later].every((t) => t.status !== 'open');
}

/** Whether a day falls in one of the plot's handed-over periods. */
export function handedOverOn(day: string, handovers: PlotTasks['handovers']): boolean {
  return handovers.some((h) => h.fromOn <= day && day <= h.toOn);
}
