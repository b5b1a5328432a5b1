import { queryOptions, useQuery } from '@tanstack/react-query';
import { pageSchema } from '@shared/schemas/common';
import { WaitlistMoveSchema } from '@shared/schemas/waitlist';
import { apiFetch } from '@/lib/api/client';
import { waitlistKeys } from './keys';

const HistoryPageSchema = pageSchema(WaitlistMoveSchema);

/** GET /api/applications/:id/history: every recorded change to someone's place, oldest first. */
export function getApplicationHistory(applicationId: number, signal?: AbortSignal) {
  return apiFetch(`/api/applications/${applicationId}/history`, { schema: HistoryPageSchema, signal });
}

/** Query options for one application's history. */
export function applicationHistoryQueryOptions(applicationId: number) {
  return queryOptions({
    queryKey: waitlistKeys.history(applicationId),
    queryFn: ({ signal }) => getApplicationHistory(applicationId, signal),
  });
}

/** One application's moves; only fetched while `enabled`. */
export function useApplicationHistory(applicationId: number, enabled: boolean) {
  return useQuery({ ...applicationHistoryQueryOptions(applicationId), enabled });
}
