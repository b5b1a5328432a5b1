import type { QueryClient } from '@tanstack/react-query';
import { plotsKeys } from './keys';

/** After any plot write on a site: its plot list, its neighbours and the plot pages. */
export async function invalidateSitePlots(queryClient: QueryClient, siteId: number) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: plotsKeys.list({ siteId }) }),
    queryClient.invalidateQueries({ queryKey: plotsKeys.neighbours({ siteId }) }),
    queryClient.invalidateQueries({ queryKey: plotsKeys.details() }),
  ]);
}
