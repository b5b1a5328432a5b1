import { useMutation, useQueryClient } from '@tanstack/react-query';
import { FeeScheduleSchema, type FeeSchedule } from '@shared/schemas/fees';
import { apiFetch } from '@/lib/api/client';
import { feesKeys } from './keys';

/** PUT /api/clubs/:clubId/fee-schedule: replaces the whole schedule. */
export function saveFeeSchedule(clubId: number, body: FeeSchedule): Promise<FeeSchedule> {
  return apiFetch(`/api/clubs/${clubId}/fee-schedule`, { method: 'PUT', body, schema: FeeScheduleSchema });
}

/** Saves the schedule and keeps the cached copy in step. */
export function useSaveFeeSchedule(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: FeeSchedule) => saveFeeSchedule(clubId, body),
    onSuccess: (saved) => queryClient.setQueryData(feesKeys.schedule(clubId), saved),
  });
}
