/** Query keys for harvest figures: `['harvests']`, `['harvests', 'detail', { clubId, year }]` (year undefined = this season). */
export const harvestsKeys = {
  all: ['harvests'] as const,
  details: () => [...harvestsKeys.all, 'detail'] as const,
  detail: (filters: { clubId: number; year?: number }) => [...harvestsKeys.details(), filters] as const,
};
