import { z } from 'zod';

/**
 * Optional mail: the kinds a person may stop with one click (List-Unsubscribe). Every other kind is
 * transactional (about the person's own account, plot, payment or place) and is always sent.
 */
export const optionalMailKinds = ['club_news', 'shift_digest', 'shift_reminder', 'shift_help'] as const;
export type OptionalMailKind = (typeof optionalMailKinds)[number];

/** What a stop link turns off, in the words of its confirm page. */
export const optionalMailWords: Record<OptionalMailKind, string> = {
  club_news: 'club news',
  shift_digest: 'the weekly e-mail of shifts that need people',
  shift_reminder: 'shift reminders the day before',
  shift_help: 'calls for help with shifts',
};

/** GET /api/mail-stops/:token: what the link stops, for whom, and whether it was used. */
export const MailStopPreviewSchema = z.object({
  kind: z.enum(optionalMailKinds),
  what: z.string(),
  clubName: z.string(),
  forName: z.string(),
  state: z.enum(['ready', 'used']),
});
export type MailStopPreview = z.infer<typeof MailStopPreviewSchema>;

export const MailTemplateSummarySchema = z.object({
  name: z.string(),
  label: z.string(),
  optional: z.boolean(),
  description: z.string(),
});
export type MailTemplateSummary = z.infer<typeof MailTemplateSummarySchema>;

export const MailTemplateListSchema = z.object({
  items: z.array(MailTemplateSummarySchema),
  page: z.number().int(),
  total: z.number().int(),
});
export type MailTemplateList = z.infer<typeof MailTemplateListSchema>;

/** One template rendered with sample data of the club; its links are fake (.invalid addresses). */
export const MailPreviewSchema = z.object({
  name: z.string(),
  subject: z.string(),
  html: z.string(),
  text: z.string(),
  headers: z.record(z.string(), z.string()),
});
export type MailPreview = z.infer<typeof MailPreviewSchema>;
