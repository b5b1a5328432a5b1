import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SiteSchema } from '@shared/schemas/sites';
import { apiFetch } from '@/lib/api/client';
import { storeSite } from './invalidate';

export interface SiteBackgroundUpload {
  image: File;
  /** The real width the image spans, in metres; leave it out to set the scale later on the map. */
  widthMetres?: number;
}

/** POST /api/sites/:siteId/background as multipart (`image`, optional `widthMetres`); answers the site. */
export function uploadSiteBackground(siteId: number, upload: SiteBackgroundUpload) {
  const form = new FormData();
  form.append('image', upload.image);
  if (upload.widthMetres !== undefined) form.append('widthMetres', String(upload.widthMetres));
  return apiFetch(`/api/sites/${siteId}/background`, { method: 'POST', body: form, schema: SiteSchema });
}

/** Uploads a new map background, replacing any earlier one. */
export function useUploadSiteBackground(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (upload: SiteBackgroundUpload) => uploadSiteBackground(siteId, upload),
    onSuccess: (site) => storeSite(queryClient, site),
  });
}
