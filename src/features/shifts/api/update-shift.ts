import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftDetailSchema, type ShiftUpdateBody } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { invalidateShifts } from './invalidate';
import { shiftsKeys } from './keys';

/** PATCH /api/shifts/:shiftId with the version last read (coordinators); 409 when someone changed it since. */
export function updateShift(shiftId: number, body: ShiftUpdateBody) {
  return apiFetch(`/api/shifts/${shiftId}`, { method: 'PATCH', body, schema: ShiftDetailSchema });
}

/** Saves a shift's changes; after a 409 too the shift is read again, so the page shows it as it is now. */
export function useUpdateShift(shiftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ShiftUpdateBody) => updateShift(shiftId, body),
    onSuccess: (shift) => queryClient.setQueryData(shiftsKeys.detail(shiftId), shift),
    onSettled: () => invalidateShifts(queryClient),
  });
}
