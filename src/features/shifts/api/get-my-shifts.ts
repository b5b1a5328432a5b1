import { queryOptions, useQuery } from '@tanstack/react-query';
import { MyShiftsSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** GET /api/clubs/:clubId/my-shifts: the person's upcoming and past shifts and their hours this season against the club's ask. */
export function getMyShifts(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/my-shifts`, { schema: MyShiftsSchema, signal });
}

/** Query options for "my shifts". */
export function myShiftsQueryOptions(clubId: number) {
  return queryOptions({ queryKey: shiftsKeys.mine(clubId), queryFn: ({ signal }) => getMyShifts(clubId, signal) });
}

/** The person's shifts and hours in one club. */
export function useMyShifts(clubId: number) {
  return useQuery(myShiftsQueryOptions(clubId));
}
