import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SiteSchema, type SiteCreateBody } from '@shared/schemas/sites';
import { apiFetch } from '@/lib/api/client';
import { storeSite } from './invalidate';

/** POST /api/clubs/:clubId/sites: adds a site (lengths in metres). */
export function createSite(clubId: number, body: SiteCreateBody) {
  return apiFetch(`/api/clubs/${clubId}/sites`, { method: 'POST', body, schema: SiteSchema });
}

/** Creates a site and refreshes the club's site list. */
export function useCreateSite(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SiteCreateBody) => createSite(clubId, body),
    onSuccess: (site) => storeSite(queryClient, site),
  });
}
