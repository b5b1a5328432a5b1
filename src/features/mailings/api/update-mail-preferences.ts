import { useMutation, useQueryClient } from '@tanstack/react-query';
import { MailPreferencesSchema, type MailPreferencesBody } from '@shared/schemas/mailings';
import { apiFetch } from '@/lib/api/client';
import { mailingsKeys } from './keys';

/** PUT /api/clubs/:clubId/mail-preferences: saves the person's optional e-mail choices. */
export function updateMailPreferences(clubId: number, body: MailPreferencesBody) {
  return apiFetch(`/api/clubs/${clubId}/mail-preferences`, { method: 'PUT', body, schema: MailPreferencesSchema });
}

/** Saves e-mail choices and keeps the cached copy in step. */
export function useUpdateMailPreferences(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MailPreferencesBody) => updateMailPreferences(clubId, body),
    onSuccess: (saved) => queryClient.setQueryData(mailingsKeys.preferences({ clubId }), saved),
  });
}
