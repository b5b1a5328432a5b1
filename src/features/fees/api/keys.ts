import type { FeesQuery } from '@shared/schemas/fees';

/** Filters that pick one of a club's fee lists. */
export interface FeesListFilters {
  clubId: number;
  year?: number;
  status: FeesQuery['status'];
}

/** Query keys for fees: `['fees']`, `['fees', 'list', filters]`, `['fees', 'mine']`, `['fees', 'schedule', clubId]`. */
export const feesKeys = {
  all: ['fees'] as const,
  lists: () => [...feesKeys.all, 'list'] as const,
  list: (filters: FeesListFilters) => [...feesKeys.lists(), filters] as const,
  mine: () => [...feesKeys.all, 'mine'] as const,
  schedule: (clubId: number) => [...feesKeys.all, 'schedule', clubId] as const,
};
