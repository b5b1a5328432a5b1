import { SeasonOpeningPreviewSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';

/** GET /api/clubs/:clubId/seasons/opening-preview: how many renewal e-mails opening `year` would send; sends nothing. */
export function getOpeningPreview(clubId: number, year: number) {
  return apiFetch(`/api/clubs/${clubId}/seasons/opening-preview?year=${year}`, { schema: SeasonOpeningPreviewSchema });
}
