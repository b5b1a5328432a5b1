import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { MyFeesListShape } from '@/lib/api/response-shapes.gen';
import { feesKeys } from './keys';

/** GET /api/me/fees: the signed-in person's own fees in every club. */
export function getMyFees(signal?: AbortSignal) {
  return apiFetch('/api/me/fees', { schema: MyFeesListShape, signal });
}

/** Query options for the signed-in person's fees. */
export function myFeesQueryOptions() {
  return queryOptions({ queryKey: feesKeys.mine(), queryFn: ({ signal }) => getMyFees(signal) });
}

/** The signed-in person's fees. */
export function useMyFees() {
  return useQuery(myFeesQueryOptions());
}
