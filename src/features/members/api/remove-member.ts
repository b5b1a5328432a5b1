import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

/** DELETE /api/clubs/:clubId/members/:userId (every role) or …/roles/:role (one role). */
export function removeMember(clubId: number, userId: number, role?: Role): Promise<undefined> {
  const path = `/api/clubs/${clubId}/members/${userId}${role ? `/roles/${role}` : ''}`;
  return apiFetch(path, { method: 'DELETE' });
}

/** Removes a member or one of their roles and refreshes the club's lists. */
export function useRemoveMember(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: number; role?: Role }) => removeMember(clubId, userId, role),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersKeys.lists() }),
  });
}
