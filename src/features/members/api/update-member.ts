import { useMutation, useQueryClient } from '@tanstack/react-query';
import { MemberSchema, type MemberUpdateBody } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

/** PATCH /api/clubs/:clubId/members/:userId: the member's whole set of roles and or their concession. */
export function updateMember(clubId: number, userId: number, body: MemberUpdateBody) {
  return apiFetch(`/api/clubs/${clubId}/members/${userId}`, { method: 'PATCH', body, schema: MemberSchema });
}

/** Changes a member and refreshes the club's members list. */
export function useUpdateMember(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, body }: { userId: number; body: MemberUpdateBody }) => updateMember(clubId, userId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersKeys.list({ clubId, kind: 'members' }) }),
  });
}
