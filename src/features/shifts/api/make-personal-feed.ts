import { useMutation, useQueryClient } from '@tanstack/react-query';
import { FeedUrlSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** POST /api/clubs/:clubId/feeds/personal: makes a new secret address for the person's shifts; any earlier one stops working. */
export function makePersonalFeed(clubId: number) {
  return apiFetch(`/api/clubs/${clubId}/feeds/personal`, { method: 'POST', schema: FeedUrlSchema });
}

/** Makes (or resets) the personal feed; its address is in the answer only, so the page shows it from there. */
export function useMakePersonalFeed(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => makePersonalFeed(clubId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shiftsKeys.feeds(clubId) }),
  });
}
