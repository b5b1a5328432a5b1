import { queryOptions, useQuery } from '@tanstack/react-query';
import { InviteSchema } from '@shared/schemas/auth';
import { pageSchema } from '@shared/schemas/common';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

const InvitesPageSchema = pageSchema(InviteSchema);

/** GET /api/clubs/:clubId/invites: invites not yet accepted (coordinators only). */
export function getInvites(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/invites`, { schema: InvitesPageSchema, signal });
}

/** Query options for a club's pending invites. */
export function invitesQueryOptions(clubId: number) {
  return queryOptions({
    queryKey: membersKeys.list({ clubId, kind: 'invites' }),
    queryFn: ({ signal }) => getInvites(clubId, signal),
  });
}

/** The club's pending invites. */
export function useInvites(clubId: number) {
  return useQuery(invitesQueryOptions(clubId));
}
