import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { invalidateShifts } from './invalidate';

/** POST /api/shifts/:shiftId/call-off {version} (coordinators): the shift will not happen. */
export function callOffShift(shiftId: number, version: number) {
  return apiFetch(`/api/shifts/${shiftId}/call-off`, { method: 'POST', body: { version }, schema: ShiftSchema });
}

/** Calls a shift off and reads the lists again, after a 409 too. */
export function useCallOffShift(shiftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (version: number) => callOffShift(shiftId, version),
    onSettled: () => invalidateShifts(queryClient),
  });
}
