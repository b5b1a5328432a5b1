import { useMutation, useQueryClient } from '@tanstack/react-query';
import { FeedUrlSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** POST /api/clubs/:clubId/feeds/club (coordinators): makes a new secret address for all the club's shifts; any earlier one stops working. */
export function makeClubFeed(clubId: number) {
  return apiFetch(`/api/clubs/${clubId}/feeds/club`, { method: 'POST', schema: FeedUrlSchema });
}

/** Makes (or resets) the club feed; its address is in the answer only. */
export function useMakeClubFeed(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => makeClubFeed(clubId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shiftsKeys.feeds(clubId) }),
  });
}
