import { z } from 'zod';
import { ShiftDoneBodySchema, type ShiftDoneBody } from '@shared/schemas/shifts';

// "How it went": a note, the hours when they differ from the estimate, and an optional photo. The
// server takes JPEG, PNG or WebP up to 8 MB (as the plot book's photos: 8 × 1024 × 1024 bytes); the
// page checks the same before sending so the answer comes at once and nothing typed is lost.

export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;

/** Why a picked photo cannot be sent, or null when it can (or none was picked). */
export function photoProblem(file: { type: string; size: number } | null | undefined): string | null {
  if (!file) return null;
  if (!(PHOTO_TYPES as readonly string[]).includes(file.type)) return 'Use a JPEG, PNG or WebP photo';
  if (file.size > MAX_PHOTO_BYTES) return 'The photo is larger than 8 MB';
  return null;
}

const HOURS_TEXT = /^\d+([.,]\d+)?$/;

/** The hours box: empty keeps the shift's estimate (null); "1.5" or "1,5" is a number of hours. */
export const hoursTextSchema = z
  .string()
  .trim()
  .refine((v) => v === '' || HOURS_TEXT.test(v), 'Enter hours like 1.5, or leave it empty')
  .transform((v) => (v === '' ? null : Number(v.replace(',', '.'))))
  .pipe(ShiftDoneBodySchema.shape.hours.unwrap());

/** The form as typed: text boxes only. */
export interface DoneFormValues {
  note: string;
  hours: string;
}

/** The form checked: what the server is sent besides the photo. */
export const DoneFormSchema = z.object({
  note: z.string().pipe(ShiftDoneBodySchema.shape.note.unwrap()),
  hours: hoursTextSchema,
});

/** The hours box starts with the shift's estimate, so most people only press the button. */
export function doneFormDefaults(estHours: number): DoneFormValues {
  return { note: '', hours: String(estHours) };
}

/**
 * The request body for "done": JSON when there is no photo; multipart with `note`, `hours` (left out
 * when null) and `photo` when there is one. `extra` adds the e-mailed link's `token`, first.
 */
export function doneRequestBody(body: ShiftDoneBody, photo: File | null, extra: { token?: string } = {}): FormData | (ShiftDoneBody & { token?: string }) {
  if (!photo) return { ...extra, ...body };
  const form = new FormData();
  if (extra.token !== undefined) form.append('token', extra.token);
  form.append('note', body.note);
  if (body.hours !== null) form.append('hours', String(body.hours));
  form.append('photo', photo);
  return form;
}
