import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ClubSettingsSchema, type ClubSettings, type ClubSettingsUpdateBody } from '@shared/schemas/clubs';
import { apiFetch } from '@/lib/api/client';
import { clubSettingsKeys } from './keys';

/** PATCH /api/clubs/:clubId (coordinators): changes only the fields sent. */
export function updateClubSettings(clubId: number, body: ClubSettingsUpdateBody): Promise<ClubSettings> {
  return apiFetch(`/api/clubs/${clubId}`, { method: 'PATCH', body, schema: ClubSettingsSchema });
}

/** Saves the club's settings and keeps the cached copy in step. */
export function useUpdateClubSettings(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ClubSettingsUpdateBody) => updateClubSettings(clubId, body),
    onSuccess: (settings) => queryClient.setQueryData(clubSettingsKeys.detail(clubId), settings),
  });
}
