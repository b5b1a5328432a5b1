import { useMutation } from '@tanstack/react-query';
import { ApplicationReceiptSchema, type ApplicationBody } from '@shared/schemas/applications';
import { apiFetch } from '@/lib/api/client';

/** POST /api/apply/:clubSlug: puts the person on the waiting list; answers their place. */
export function submitApplication(slug: string, body: ApplicationBody) {
  return apiFetch(`/api/apply/${encodeURIComponent(slug)}`, { method: 'POST', body, schema: ApplicationReceiptSchema });
}

/** Sends the public application form. */
export function useSubmitApplication(slug: string) {
  return useMutation({ mutationFn: (body: ApplicationBody) => submitApplication(slug, body) });
}
