import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApplyInfoSchema } from '@shared/schemas/applications';
import { apiFetch } from '@/lib/api/client';
import { waitlistKeys } from './keys';

/** GET /api/apply/:clubSlug: the club's name and sites for the public form (no sign-in). */
export function getApplyInfo(slug: string, signal?: AbortSignal) {
  return apiFetch(`/api/apply/${encodeURIComponent(slug)}`, { schema: ApplyInfoSchema, signal });
}

/** Query options for the public form's club details. */
export function applyInfoQueryOptions(slug: string) {
  return queryOptions({ queryKey: waitlistKeys.applyInfo(slug), queryFn: ({ signal }) => getApplyInfo(slug, signal) });
}

/** The club a public application goes to. */
export function useApplyInfo(slug: string) {
  return useQuery(applyInfoQueryOptions(slug));
}
