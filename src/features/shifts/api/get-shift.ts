import { queryOptions, useQuery } from '@tanstack/react-query';
import { ShiftDetailSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** GET /api/shifts/:shiftId (members): a shift with its tasks, and its people for coordinators. */
export function getShift(shiftId: number, signal?: AbortSignal) {
  return apiFetch(`/api/shifts/${shiftId}`, { schema: ShiftDetailSchema, signal });
}

/** Query options for one shift. */
export function shiftQueryOptions(shiftId: number) {
  return queryOptions({ queryKey: shiftsKeys.detail(shiftId), queryFn: ({ signal }) => getShift(shiftId, signal) });
}

/** One shift with everything about it. */
export function useShift(shiftId: number) {
  return useQuery(shiftQueryOptions(shiftId));
}
