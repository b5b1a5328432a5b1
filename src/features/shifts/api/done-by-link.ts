import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftLinkPreviewSchema, type ShiftDoneBody } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { doneRequestBody } from '../lib/done-form';
import { shiftsKeys } from './keys';

/** POST /api/shift-links/done: JSON {token, note, hours}, or multipart (token, note, hours, photo) with a photo. */
export function doneByLink(token: string, body: ShiftDoneBody, photo: File | null) {
  return apiFetch('/api/shift-links/done', { method: 'POST', body: doneRequestBody(body, photo, { token }), schema: ShiftLinkPreviewSchema });
}

/** Says how the shift went from the e-mail, and keeps the answer as the link's preview. */
export function useDoneByLink(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ body, photo }: { body: ShiftDoneBody; photo: File | null }) => doneByLink(token, body, photo),
    onSuccess: (preview) => queryClient.setQueryData(shiftsKeys.link(token), preview),
  });
}
