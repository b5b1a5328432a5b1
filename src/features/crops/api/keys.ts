/** Query keys for crop notes: `['crops']`, `['crops', 'list', { clubId }]`, `['crops', 'detail', { clubId, cropId }]`. */
export const cropsKeys = {
  all: ['crops'] as const,
  lists: () => [...cropsKeys.all, 'list'] as const,
  list: (filters: { clubId: number }) => [...cropsKeys.lists(), filters] as const,
  details: () => [...cropsKeys.all, 'detail'] as const,
  // A crop's values differ per club (overrides, club relations), so the club is part of the key.
  detail: (ids: { clubId: number; cropId: number }) => [...cropsKeys.details(), ids] as const,
};
