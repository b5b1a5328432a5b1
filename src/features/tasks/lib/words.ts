import { taskKinds } from '@shared/schemas/labels';
import type { TaskKind, TaskView } from '@shared/schemas/tasks';

type TaskStatus = TaskView['status'];

/** Each kind of task in one or two words; shown beside its icon so the icon is never the only signal. */
export const kindWords: Record<TaskKind, string> = {
  water: 'Watering',
  weed: 'Weeding',
  thin: 'Thinning',
  side_dress: 'Feeding',
  mulch: 'Mulching',
  scout: 'Pest check',
  harvest: 'Harvest',
  other: 'Other',
};

/** Where a task stands, in words. */
export const statusWords: Record<TaskStatus, string> = {
  open: 'To do',
  done: 'Done',
  skipped: 'Not needed',
};

/** The kinds in the order forms and filters list them. */
export const kindOrder: readonly TaskKind[] = taskKinds;
