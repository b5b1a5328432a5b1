import { queryOptions, useQuery } from '@tanstack/react-query';
import { MailPreviewSchema, MailTemplateListSchema } from '@shared/schemas/mail-templates';
import { apiFetch } from '@/lib/api/client';
import { outboxKeys } from './keys';

/** GET /api/clubs/:clubId/mail-templates: every e-mail the product sends, and whether it is optional (coordinators). */
export function getMailTemplates(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/mail-templates`, { schema: MailTemplateListSchema, signal });
}

export function useMailTemplates(clubId: number) {
  return useQuery(queryOptions({ queryKey: outboxKeys.templates(clubId), queryFn: ({ signal }) => getMailTemplates(clubId, signal) }));
}

/** GET /api/clubs/:clubId/mail-templates/:name/preview: one template with the club's sample data and fake links. */
export function getMailPreview(clubId: number, name: string, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/mail-templates/${encodeURIComponent(name)}/preview`, { schema: MailPreviewSchema, signal });
}

export function useMailPreview(clubId: number, name: string | null) {
  return useQuery({
    queryKey: outboxKeys.preview(clubId, name ?? ''),
    queryFn: ({ signal }) => getMailPreview(clubId, name!, signal),
    enabled: name !== null,
  });
}
