import { queryOptions, useQuery } from '@tanstack/react-query';
import { FeeScheduleSchema } from '@shared/schemas/fees';
import { apiFetch } from '@/lib/api/client';
import { feesKeys } from './keys';

/** GET /api/clubs/:clubId/fee-schedule (coordinators): all zero until one is saved. */
export function getFeeSchedule(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/fee-schedule`, { schema: FeeScheduleSchema, signal });
}

/** Query options for a club's fee schedule. */
export function feeScheduleQueryOptions(clubId: number) {
  return queryOptions({ queryKey: feesKeys.schedule(clubId), queryFn: ({ signal }) => getFeeSchedule(clubId, signal) });
}

/** The club's fee schedule. */
export function useFeeSchedule(clubId: number) {
  return useQuery(feeScheduleQueryOptions(clubId));
}
