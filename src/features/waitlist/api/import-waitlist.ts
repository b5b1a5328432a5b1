import { useMutation, useQueryClient } from '@tanstack/react-query';
import { WaitlistImportResultSchema } from '@shared/schemas/member-imports';
import { apiFetch } from '@/lib/api/client';
import { waitlistKeys } from './keys';

/** POST /api/clubs/:clubId/member-imports with kind waiting list: checks (commit false) or saves every row or none. */
export function importWaitlist(clubId: number, csv: string, commit: boolean) {
  return apiFetch(`/api/clubs/${clubId}/member-imports`, {
    method: 'POST',
    body: { kind: 'waitlist', csv, commit },
    schema: WaitlistImportResultSchema,
  });
}

/** Checks or imports a waiting list CSV; a committed import refreshes the waiting list. */
export function useImportWaitlist(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ csv, commit }: { csv: string; commit: boolean }) => importWaitlist(clubId, csv, commit),
    onSuccess: async (result) => {
      if (result.committed) await queryClient.invalidateQueries({ queryKey: waitlistKeys.lists() });
    },
  });
}
