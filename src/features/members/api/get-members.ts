import { queryOptions, useQuery } from '@tanstack/react-query';
import { MemberSchema } from '@shared/schemas/auth';
import { pageSchema } from '@shared/schemas/common';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

const MembersPageSchema = pageSchema(MemberSchema);

/** GET /api/clubs/:clubId/members (coordinators only). */
export function getMembers(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/members`, { schema: MembersPageSchema, signal });
}

/** Query options for a club's member list. */
export function membersQueryOptions(clubId: number) {
  return queryOptions({
    queryKey: membersKeys.list({ clubId, kind: 'members' }),
    queryFn: ({ signal }) => getMembers(clubId, signal),
  });
}

/** The club's members, one page as the server sends it. */
export function useMembers(clubId: number) {
  return useQuery(membersQueryOptions(clubId));
}
