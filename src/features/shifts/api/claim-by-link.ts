import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftLinkPreviewSchema } from '@shared/schemas/shifts';
import { apiFetch, isApiError } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** POST /api/shift-links/claim {token}: takes the place the link offers; answers the preview ('yours'), or 409 when it is already covered. */
export function claimByLink(token: string) {
  return apiFetch('/api/shift-links/claim', { method: 'POST', body: { token }, schema: ShiftLinkPreviewSchema });
}

/** Takes the place; on a 409 the preview is read again so the page shows "full" with the other shifts. */
export function useClaimByLink(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => claimByLink(token),
    onSuccess: (preview) => queryClient.setQueryData(shiftsKeys.link(token), preview),
    onError: (error) => {
      if (isApiError(error, 409)) return queryClient.invalidateQueries({ queryKey: shiftsKeys.link(token) });
    },
  });
}
