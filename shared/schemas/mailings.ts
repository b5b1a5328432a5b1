import { z } from 'zod';
import { IdSchema, textSchema } from './common';

const YearSchema = z.number().int('A year like 2027').min(2000, 'A year like 2027').max(2100, 'A year like 2027');

/** Who a club message goes to: one season's plot holders, one site's holders that season, or every member. */
export const MailingAudienceSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('season'), year: YearSchema }),
  z.strictObject({ kind: z.literal('site'), siteId: IdSchema, year: YearSchema }),
  z.strictObject({ kind: z.literal('all_members') }),
]);
export type MailingAudience = z.infer<typeof MailingAudienceSchema>;

const wholeNumberText = z.string().regex(/^\d{1,10}$/, 'A whole number').transform(Number);

/** `GET …/mailings/audience?kind=site&year=2027&siteId=4`: the audience as a query string. */
export const MailingAudienceQuerySchema = z
  .strictObject({ kind: z.string(), year: wholeNumberText.optional(), siteId: wholeNumberText.optional() })
  .pipe(MailingAudienceSchema);

/** How many people a message to an audience would reach now, and how many turned club news off. */
export const MailingAudienceCountSchema = z.object({ recipients: z.number().int(), skipped: z.number().int() });
export type MailingAudienceCount = z.infer<typeof MailingAudienceCountSchema>;

export const MailingCreateBodySchema = z.strictObject({
  subject: textSchema({ min: 1, minMessage: 'Enter a subject', max: 200 }),
  body: textSchema({ min: 1, minMessage: 'Write the message', max: 20_000, maxMessage: 'At most 20,000 characters', multiline: true }),
  audience: MailingAudienceSchema,
});
export type MailingCreateBody = z.infer<typeof MailingCreateBodySchema>;

/** What sending answers: how many people the audience held, how many were sent to, how many opted out. */
export const MailingSentSchema = z.object({
  id: z.number().int(),
  recipients: z.number().int(),
  sent: z.number().int(),
  skipped: z.number().int(),
});
export type MailingSent = z.infer<typeof MailingSentSchema>;

/** A message the club sent, as the coordinator's list shows it. */
export const MailingSchema = z.object({
  id: z.number().int(),
  subject: z.string(),
  body: z.string(),
  audience: MailingAudienceSchema,
  audienceLabel: z.string(),
  recipientCount: z.number().int(),
  sentCount: z.number().int(),
  sentByName: z.string().nullable(),
  createdAt: z.string(),
});
export type Mailing = z.infer<typeof MailingSchema>;

/** The one optional topic: club news from the coordinator. Offers, renewals, receipts and resets are always sent. */
export const MailPreferencesSchema = z.object({ clubNews: z.boolean() });
export type MailPreferences = z.infer<typeof MailPreferencesSchema>;

export const MailPreferencesBodySchema = z.strictObject({ clubNews: z.boolean() });
export type MailPreferencesBody = z.infer<typeof MailPreferencesBodySchema>;
