import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Site } from '@shared/schemas/sites';
import { apiFetch } from '@/lib/api/client';
import { sitesKeys } from './keys';

/** POST /api/sites/:siteId/archive: the site leaves the lists and the map; its plots, fees and payments stay. */
export function archiveSite(site: Pick<Site, 'id' | 'version'>) {
  return apiFetch<void>(`/api/sites/${site.id}/archive`, { method: 'POST', body: { version: site.version } });
}

/** DELETE /api/sites/:siteId?version=: only a site with no allocations, fees or payments; 409 otherwise. */
export function deleteSite(site: Pick<Site, 'id' | 'version'>) {
  return apiFetch<void>(`/api/sites/${site.id}?version=${site.version}`, { method: 'DELETE' });
}

/** Archives or deletes a site, then drops it from every cached list. */
export function useRemoveSite(site: Site) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (how: 'archive' | 'delete') => (how === 'archive' ? archiveSite(site) : deleteSite(site)),
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: sitesKeys.detail(site.id) });
      await queryClient.invalidateQueries({ queryKey: sitesKeys.lists() });
    },
    onError: () => queryClient.invalidateQueries({ queryKey: sitesKeys.detail(site.id) }),
  });
}
