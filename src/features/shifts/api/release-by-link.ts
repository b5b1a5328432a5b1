import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShiftLinkPreviewSchema } from '@shared/schemas/shifts';
import { apiFetch, isApiError } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** POST /api/shift-links/release {token}: gives the place back; answers the preview as it is now. */
export function releaseByLink(token: string) {
  return apiFetch('/api/shift-links/release', { method: 'POST', body: { token }, schema: ShiftLinkPreviewSchema });
}

/**
 * Gives the place back from the e-mail; the answer stays with the mutation (the page keeps its thanks),
 * and a 409 reads the preview again to show where the link stands.
 */
export function useReleaseByLink(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => releaseByLink(token),
    onError: (error) => {
      if (isApiError(error, 409)) return queryClient.invalidateQueries({ queryKey: shiftsKeys.link(token) });
    },
  });
}
