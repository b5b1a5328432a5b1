import type { TaskView } from '@shared/schemas/tasks';
import { filterParams, type SiteTaskFilters } from './filters';

// Words and small rules of the coordinators' tasks table.

/**
 * Who a task is for: the plot's holder; the volunteers while the holder is away; the coordinators for a task on the
 * whole site or on a shared bed (nobody holds those; only coordinators and volunteers handed a task may mark them).
 */
export function whoForWords(task: Pick<TaskView, 'plotId' | 'forVolunteers'>, plotKind?: string): string {
  if (task.forVolunteers) return 'Volunteers, while the holder is away';
  if (task.plotId === null || plotKind === 'shared_bed') return 'Coordinators';
  return 'Plot holder';
}

/** Where a task is: "A-1", or "Whole site" for a task on no plot. */
export function whereWords(task: Pick<TaskView, 'plotLabel'>): string {
  return task.plotLabel ?? 'Whole site';
}

/** Only tasks a coordinator added can be deleted; generated ones follow their planting. */
export function canDeleteTask(task: Pick<TaskView, 'origin'>): boolean {
  return task.origin === 'coordinator';
}

/** "Added 1 task." / "Added 12 tasks." after the add dialog. */
export function addedWords(created: number): string {
  return `Added ${created} ${created === 1 ? 'task' : 'tasks'}.`;
}

/**
 * The page's search params with one filter set (or removed when `value` is empty); other filters and any other
 * params stay. Filter names are kept in the fixed order the API reads them in.
 */
export function withFilter(params: URLSearchParams, name: (typeof filterParams)[number], value: string): URLSearchParams {
  const next = new URLSearchParams();
  for (const n of filterParams) {
    const v = n === name ? value : params.get(n);
    if (v) next.set(n, v);
  }
  for (const [key, v] of params) if (!(filterParams as readonly string[]).includes(key)) next.append(key, v);
  return next;
}

/** The page's search params with every filter removed. */
export function withoutFilters(params: URLSearchParams): URLSearchParams {
  const next = new URLSearchParams();
  for (const [key, v] of params) if (!(filterParams as readonly string[]).includes(key)) next.append(key, v);
  return next;
}

/** The message for dates the wrong way round (the server's words), or null. */
export function dateRangeError(filters: Pick<SiteTaskFilters, 'from' | 'to'>): string | null {
  return filters.from && filters.to && filters.from > filters.to ? 'Must be on or after the first date' : null;
}

/** "12 tasks" / "1 task", and " (filtered)" when a filter is set. */
export function countWords(n: number, filtered: boolean): string {
  return `${n} ${n === 1 ? 'task' : 'tasks'}${filtered ? ' (filtered)' : ''}`;
}
