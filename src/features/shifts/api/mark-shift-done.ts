import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftSchema, type ShiftDoneBody } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { doneRequestBody } from '../lib/done-form';
import { invalidateShifts } from './invalidate';

export interface ShiftDoneInput {
  body: ShiftDoneBody;
  photo: File | null;
}

/**
 * POST /api/shifts/:shiftId/done: how it went. JSON {note, hours} without a photo; multipart
 * (note, hours, photo: JPEG/PNG/WebP up to 8 MB) with one.
 */
export function markShiftDone(shiftId: number, { body, photo }: ShiftDoneInput) {
  return apiFetch(`/api/shifts/${shiftId}/done`, { method: 'POST', body: doneRequestBody(body, photo), schema: ShiftSchema });
}

/** Marks the person's place done and reads the lists and their hours again. */
export function useMarkShiftDone(shiftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ShiftDoneInput) => markShiftDone(shiftId, input),
    onSuccess: () => invalidateShifts(queryClient),
  });
}
