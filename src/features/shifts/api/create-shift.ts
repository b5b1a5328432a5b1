import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftDetailSchema, type ShiftCreateBody } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { invalidateShifts } from './invalidate';
import { shiftsKeys } from './keys';

/** POST /api/clubs/:clubId/shifts (coordinators; 201): a shift from a suggestion, or a work day of the coordinator's own. */
export function createShift(clubId: number, body: ShiftCreateBody, idempotencyKey?: string) {
  return apiFetch(`/api/clubs/${clubId}/shifts`, { method: 'POST', body, schema: ShiftDetailSchema, idempotencyKey });
}

/** Creates a shift; the suggestion it came from goes from the list because the suggestions are read again. */
export function useCreateShift(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ body, idempotencyKey }: { body: ShiftCreateBody; idempotencyKey?: string }) => createShift(clubId, body, idempotencyKey),
    onSuccess: async (shift) => {
      queryClient.setQueryData(shiftsKeys.detail(shift.id), shift);
      await invalidateShifts(queryClient);
    },
  });
}
