import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SiteSchema, type SiteUpdateBody } from '@shared/schemas/sites';
import { apiFetch, isApiError } from '@/lib/api/client';
import { sitesKeys } from './keys';
import { storeSite } from './invalidate';

/** PATCH /api/sites/:siteId with the version the form was filled from; 409 when someone changed it since. */
export function updateSite(siteId: number, body: SiteUpdateBody) {
  return apiFetch(`/api/sites/${siteId}`, { method: 'PATCH', body, schema: SiteSchema });
}

/** True when a save failed because the site changed under the form. */
export function isSiteConflict(error: unknown): boolean {
  return isApiError(error, 409);
}

/** Saves a change to a site; on a version conflict it refetches the site so the form can show the saved one. */
export function useUpdateSite(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SiteUpdateBody) => updateSite(siteId, body),
    onSuccess: (site) => storeSite(queryClient, site),
    onError: (error) => {
      if (isSiteConflict(error)) void queryClient.invalidateQueries({ queryKey: sitesKeys.detail(siteId) });
    },
  });
}
