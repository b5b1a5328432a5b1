import { useMutation } from '@tanstack/react-query';
import { ShiftLinkPreviewSchema, type ShiftDoneBody } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { doneRequestBody } from '../lib/done-form';

/** POST /api/shift-links/done: JSON {token, note, hours}, or multipart (token, note, hours, photo) with a photo. */
export function doneByLink(token: string, body: ShiftDoneBody, photo: File | null) {
  return apiFetch('/api/shift-links/done', { method: 'POST', body: doneRequestBody(body, photo, { token }), schema: ShiftLinkPreviewSchema });
}

/**
 * Says how the shift went from the e-mail. The answer stays with the mutation, not the link's preview,
 * so the page keeps saying thank you instead of "this link has been used".
 */
export function useDoneByLink(token: string) {
  return useMutation({
    mutationFn: ({ body, photo }: { body: ShiftDoneBody; photo: File | null }) => doneByLink(token, body, photo),
  });
}
