import type { ShiftKind } from '@shared/schemas/shifts';

/** The board's filters as the server reads them. */
export interface ShiftListFilters {
  clubId: number;
  from: string;
  to: string;
  siteId?: number;
  kind?: ShiftKind;
  open?: boolean;
}

/**
 * Query keys for shifts: `['shifts', 'list', filters]` for the board, `['shifts', 'detail', shiftId]`,
 * `['shifts', 'suggestions', filters]`, `['shifts', 'mine', clubId]`, `['shifts', 'hours', clubId, year]`,
 * `['shifts', 'volunteer-settings', clubId]`, `['shifts', 'feeds', clubId]` and `['shifts', 'link', token]`
 * for an e-mailed link. A change to a shift invalidates everything but the settings, feeds and links.
 */
export const shiftsKeys = {
  all: ['shifts'] as const,
  lists: () => [...shiftsKeys.all, 'list'] as const,
  list: (filters: ShiftListFilters) => [...shiftsKeys.lists(), filters] as const,
  details: () => [...shiftsKeys.all, 'detail'] as const,
  detail: (shiftId: number) => [...shiftsKeys.details(), shiftId] as const,
  suggestions: () => [...shiftsKeys.all, 'suggestions'] as const,
  suggestionList: (filters: { clubId: number; from: string; to: string; siteId?: number }) => [...shiftsKeys.suggestions(), filters] as const,
  mine: (clubId: number) => [...shiftsKeys.all, 'mine', clubId] as const,
  hoursAll: () => [...shiftsKeys.all, 'hours'] as const,
  hours: (clubId: number, year: number | null) => [...shiftsKeys.hoursAll(), clubId, year] as const,
  volunteerSettings: (clubId: number) => [...shiftsKeys.all, 'volunteer-settings', clubId] as const,
  feeds: (clubId: number) => [...shiftsKeys.all, 'feeds', clubId] as const,
  link: (token: string) => [...shiftsKeys.all, 'link', token] as const,
};
