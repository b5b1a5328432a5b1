import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { OutboxListSchema, type OutboxQuery } from '@shared/schemas/outbox';
import { apiFetch } from '@/lib/api/client';
import { outboxKeys } from './keys';

/** GET /api/clubs/:clubId/outbox: the club's outgoing e-mail, failed first (coordinators only). */
export function getOutbox(clubId: number, query: OutboxQuery, signal?: AbortSignal) {
  const params = new URLSearchParams({ status: query.status, page: String(query.page) });
  return apiFetch(`/api/clubs/${clubId}/outbox?${params}`, { schema: OutboxListSchema, signal });
}

/** Query options for one page of the club's outgoing mail. */
export function outboxQueryOptions(clubId: number, query: OutboxQuery) {
  return queryOptions({
    queryKey: outboxKeys.list({ clubId, ...query }),
    queryFn: ({ signal }) => getOutbox(clubId, query, signal),
    placeholderData: keepPreviousData,
  });
}

/** The club's outgoing mail with one status (or all). */
export function useOutbox(clubId: number, query: OutboxQuery) {
  return useQuery(outboxQueryOptions(clubId, query));
}
