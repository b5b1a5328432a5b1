import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { VolunteerSettingsSchema, type VolunteerSettingsBodySchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

export type VolunteerSettingsBody = z.infer<typeof VolunteerSettingsBodySchema>;

/** PUT /api/clubs/:clubId/volunteer-settings {digestDay?, helpMail?, reminders?}: saves the person's shift e-mail choices. */
export function updateVolunteerSettings(clubId: number, body: VolunteerSettingsBody) {
  return apiFetch(`/api/clubs/${clubId}/volunteer-settings`, { method: 'PUT', body, schema: VolunteerSettingsSchema });
}

/** Saves the choices and keeps the cached copy in step. */
export function useUpdateVolunteerSettings(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: VolunteerSettingsBody) => updateVolunteerSettings(clubId, body),
    onSuccess: (saved) => queryClient.setQueryData(shiftsKeys.volunteerSettings(clubId), saved),
  });
}
