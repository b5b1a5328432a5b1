import { queryOptions, useQuery } from '@tanstack/react-query';
import { FeedStatusSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** GET /api/clubs/:clubId/feeds: whether the person's and the club's calendar feeds exist and when they were made (never their addresses). */
export function getFeeds(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/feeds`, { schema: FeedStatusSchema, signal });
}

/** Query options for the feeds' status. */
export function feedsQueryOptions(clubId: number) {
  return queryOptions({ queryKey: shiftsKeys.feeds(clubId), queryFn: ({ signal }) => getFeeds(clubId, signal) });
}

/** Whether the calendar feeds exist. */
export function useFeeds(clubId: number) {
  return useQuery(feedsQueryOptions(clubId));
}
