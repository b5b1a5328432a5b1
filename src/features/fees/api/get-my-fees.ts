import { queryOptions, useQuery } from '@tanstack/react-query';
import { MyFeesListSchema } from '@shared/schemas/fees';
import { apiFetch } from '@/lib/api/client';
import { feesKeys } from './keys';

/** GET /api/me/fees: the signed-in person's own fees in every club. */
export function getMyFees(signal?: AbortSignal) {
  return apiFetch('/api/me/fees', { schema: MyFeesListSchema, signal });
}

/** Query options for the signed-in person's fees. */
export function myFeesQueryOptions() {
  return queryOptions({ queryKey: feesKeys.mine(), queryFn: ({ signal }) => getMyFees(signal) });
}

/** The signed-in person's fees. */
export function useMyFees() {
  return useQuery(myFeesQueryOptions());
}
