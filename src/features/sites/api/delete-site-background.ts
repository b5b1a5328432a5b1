import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { invalidateSite } from './invalidate';

/** DELETE /api/sites/:siteId/background: takes the map background off the site. */
export function deleteSiteBackground(siteId: number) {
  return apiFetch<void>(`/api/sites/${siteId}/background`, { method: 'DELETE' });
}

/** Removes the map background and refetches the site (its version moved on). */
export function useDeleteSiteBackground(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteSiteBackground(siteId),
    onSuccess: () => invalidateSite(queryClient, siteId),
  });
}
