import type { QueryClient } from '@tanstack/react-query';
import { cropsKeys } from './keys';

/**
 * After a club value or a club crop changes: every crop list and detail, and every plot book (its
 * dates come from the club's crop values). Features do not import each other, so the plot book's
 * prefix is written out here; it is `plotBookKeys.all` in src/features/plot-book/api/keys.ts.
 */
export function invalidateCropsAndPlotBooks(queryClient: QueryClient) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: cropsKeys.all }),
    queryClient.invalidateQueries({ queryKey: ['plot-book'] }),
  ]);
}
