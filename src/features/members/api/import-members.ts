import { useMutation, useQueryClient } from '@tanstack/react-query';
import { MembersImportResultSchema } from '@shared/schemas/member-imports';
import { apiFetch } from '@/lib/api/client';
import { membersKeys } from './keys';

/** POST /api/clubs/:clubId/member-imports: checks (commit false) or saves every row or none. */
export function importMembers(clubId: number, csv: string, commit: boolean) {
  return apiFetch(`/api/clubs/${clubId}/member-imports`, {
    method: 'POST',
    body: { csv, commit },
    schema: MembersImportResultSchema,
  });
}

/** Checks or imports a members CSV; a committed import refreshes the member and invite lists. */
export function useImportMembers(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ csv, commit }: { csv: string; commit: boolean }) => importMembers(clubId, csv, commit),
    onSuccess: async (result) => {
      if (result.committed) await queryClient.invalidateQueries({ queryKey: membersKeys.lists() });
    },
  });
}
