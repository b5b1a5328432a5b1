import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { invalidateShifts } from './invalidate';

/** POST /api/shifts/:shiftId/claim (signed-in volunteers and coordinators): takes a place; 409 with a message when every place is taken. */
export function claimShift(shiftId: number) {
  return apiFetch(`/api/shifts/${shiftId}/claim`, { method: 'POST', schema: ShiftSchema });
}

/** Takes a place and reads the board again, after a 409 too (so the card shows the shift as it is now). */
export function useClaimShift() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (shiftId: number) => claimShift(shiftId),
    onSettled: () => invalidateShifts(queryClient),
  });
}
