import { queryOptions, useQuery } from '@tanstack/react-query';
import { VolunteerSettingsSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** GET /api/clubs/:clubId/volunteer-settings: the person's e-mail choices about shifts (weekly e-mail day, help e-mails). */
export function getVolunteerSettings(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/volunteer-settings`, { schema: VolunteerSettingsSchema, signal });
}

/** Query options for the person's shift e-mail choices. */
export function volunteerSettingsQueryOptions(clubId: number) {
  return queryOptions({ queryKey: shiftsKeys.volunteerSettings(clubId), queryFn: ({ signal }) => getVolunteerSettings(clubId, signal) });
}

/** The person's shift e-mail choices in one club. */
export function useVolunteerSettings(clubId: number) {
  return useQuery(volunteerSettingsQueryOptions(clubId));
}
