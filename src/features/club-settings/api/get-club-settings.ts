import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { ClubSettingsShape } from '@/lib/api/response-shapes.gen';
import { clubSettingsKeys } from './keys';

/** GET /api/clubs/:clubId: the club's name and spring-round rules (any member). */
export function getClubSettings(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}`, { schema: ClubSettingsShape, signal });
}

/** Query options for one club's settings. */
export function clubSettingsQueryOptions(clubId: number) {
  return queryOptions({
    queryKey: clubSettingsKeys.detail(clubId),
    queryFn: ({ signal }) => getClubSettings(clubId, signal),
  });
}

/** The club's settings, including the currency its money is shown in. */
export function useClubSettings(clubId: number, enabled = true) {
  return useQuery({ ...clubSettingsQueryOptions(clubId), enabled });
}
