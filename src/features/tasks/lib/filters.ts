import { taskKinds, taskStatuses, type SiteTaskQuery } from '@shared/schemas/tasks';
import { isCalendarDate } from './dates';

/** The site tasks table's filters as the page keeps them: only those set, already checked. */
export interface SiteTaskFilters {
  from?: string;
  to?: string;
  kind?: SiteTaskQuery['kind'];
  plotId?: number;
  status?: SiteTaskQuery['status'];
}

/** The URL's names for the filters, the same names the API reads. */
export const filterParams = ['from', 'to', 'kind', 'plotId', 'status'] as const;

function pick<T extends string>(value: string | null, allowed: readonly T[]): T | undefined {
  return allowed.find((a) => a === value);
}

/**
 * Reads the filters from the page's search params, dropping anything that is not a real value: an unknown kind
 * or status, a date that is not YYYY-MM-DD, a plot that is not one of `plotIds` (when given).
 */
export function filtersFromParams(params: URLSearchParams, plotIds?: readonly number[]): SiteTaskFilters {
  const filters: SiteTaskFilters = {};
  const from = params.get('from');
  const to = params.get('to');
  if (from && isCalendarDate(from)) filters.from = from;
  if (to && isCalendarDate(to)) filters.to = to;
  const kind = pick(params.get('kind'), taskKinds);
  if (kind) filters.kind = kind;
  const status = pick(params.get('status'), taskStatuses);
  if (status) filters.status = status;
  const plotText = params.get('plotId');
  if (plotText && /^[1-9]\d{0,9}$/.test(plotText)) {
    const plotId = Number(plotText);
    if (!plotIds || plotIds.includes(plotId)) filters.plotId = plotId;
  }
  return filters;
}

/** The query string the API and the CSV link take ("?from=…&kind=water"), in a fixed order; empty with no filters. */
export function filtersQuery(filters: SiteTaskFilters): string {
  const q = new URLSearchParams();
  for (const name of filterParams) {
    const value = filters[name];
    if (value !== undefined && value !== '') q.set(name, String(value));
  }
  const text = q.toString();
  return text ? `?${text}` : '';
}

/** Whether any filter is set. */
export function isFiltered(filters: SiteTaskFilters): boolean {
  return filterParams.some((name) => filters[name] !== undefined);
}
