import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { invalidateShifts } from './invalidate';

/** POST /api/shifts/:shiftId/release: gives the person's place back for someone else. */
export function releaseShift(shiftId: number) {
  return apiFetch(`/api/shifts/${shiftId}/release`, { method: 'POST', schema: ShiftSchema });
}

/** Gives a place back and reads the board again. */
export function useReleaseShift() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (shiftId: number) => releaseShift(shiftId),
    onSettled: () => invalidateShifts(queryClient),
  });
}
