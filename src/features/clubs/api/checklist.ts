import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ClubChecklistSchema, type ClubChecklist } from '@shared/schemas/club-signups';
import { apiFetch } from '@/lib/api/client';

/** Query keys for the clubs feature's checklist: `['clubs', 'checklist', clubId]`. */
export const checklistKeys = {
  detail: (clubId: number) => ['clubs', 'checklist', clubId] as const,
};

/** GET /api/clubs/:clubId/checklist (coordinators): each first-run step, done or not, from the club's data. */
export function getChecklist(clubId: number, signal?: AbortSignal): Promise<ClubChecklist> {
  return apiFetch(`/api/clubs/${clubId}/checklist`, { schema: ClubChecklistSchema, signal });
}

export function checklistQueryOptions(clubId: number) {
  return queryOptions({ queryKey: checklistKeys.detail(clubId), queryFn: ({ signal }) => getChecklist(clubId, signal) });
}

export function useChecklist(clubId: number) {
  return useQuery(checklistQueryOptions(clubId));
}

/** PATCH /api/clubs/:clubId/checklist: hide the checklist, or bring it back. */
export function useSetChecklistHidden(clubId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (hidden: boolean) =>
      apiFetch(`/api/clubs/${clubId}/checklist`, { method: 'PATCH', body: { hidden }, schema: ClubChecklistSchema }),
    onSuccess: (data) => queryClient.setQueryData(checklistKeys.detail(clubId), data),
  });
}
