import type { QueryClient } from '@tanstack/react-query';
import type { Site } from '@shared/schemas/sites';
import { sitesKeys } from './keys';

/** After the server answers a write with the site: keep that answer and refresh the club's list. */
export async function storeSite(queryClient: QueryClient, site: Site) {
  queryClient.setQueryData(sitesKeys.detail(site.id), site);
  await queryClient.invalidateQueries({ queryKey: sitesKeys.list({ clubId: site.clubId }) });
}

/** After a write elsewhere changes a site (e.g. its plot count): refetch it and every site list. */
export async function invalidateSite(queryClient: QueryClient, siteId: number) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: sitesKeys.detail(siteId) }),
    queryClient.invalidateQueries({ queryKey: sitesKeys.lists() }),
  ]);
}
