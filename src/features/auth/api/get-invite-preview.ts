import { queryOptions, useQuery } from '@tanstack/react-query';
import { InvitePreviewSchema, type InvitePreview } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { authKeys } from './keys';

/** GET /api/invites/preview: who is invited to which club, before they accept. */
export function getInvitePreview(token: string, signal?: AbortSignal): Promise<InvitePreview> {
  return apiFetch(`/api/invites/preview?token=${encodeURIComponent(token)}`, { schema: InvitePreviewSchema, signal });
}

/** Query options for one invite preview; the token is the id. */
export function invitePreviewQueryOptions(token: string) {
  return queryOptions({
    queryKey: authKeys.invitePreview(token),
    queryFn: ({ signal }) => getInvitePreview(token, signal),
    staleTime: 5 * 60_000,
  });
}

/** The preview for the invite link being viewed. */
export function useInvitePreview(token: string) {
  return useQuery(invitePreviewQueryOptions(token));
}
