import { z } from 'zod';

/** Ids are time-sortable, lowercase base-36 and safe to use as file names. */
export const MessageIdSchema = z.string().regex(/^[0-9a-z]{18}$/);

/** One stored e-mail, exactly as it is kept on disk and served by the JSON API. */
export const MessageSchema = z.object({
  id: MessageIdSchema,
  from: z.string(),
  fromName: z.string().nullable(),
  to: z.array(z.string()),
  cc: z.array(z.string()),
  envelope: z.object({ from: z.string().nullable(), to: z.array(z.string()) }),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  date: z.iso.datetime(),
  receivedAt: z.iso.datetime(),
  messageId: z.string().nullable(),
  headers: z.record(z.string(), z.string()),
  /** Files sent with the message; text files (a calendar's .ics) keep their text. Older stored messages have none. */
  attachments: z
    .array(z.object({ filename: z.string().nullable(), contentType: z.string(), size: z.number().int(), text: z.string().nullable() }))
    .default([]),
});
export type Message = z.infer<typeof MessageSchema>;

/** The short form used in lists. */
export const MessageSummarySchema = MessageSchema.pick({
  id: true,
  from: true,
  to: true,
  subject: true,
  date: true,
  receivedAt: true,
});
export type MessageSummary = z.infer<typeof MessageSummarySchema>;

/** Body of `GET /api/messages`; there is only ever one page, the dev inbox stays small. */
export const MessageListSchema = z.object({
  items: z.array(MessageSummarySchema),
  page: z.literal(1),
  total: z.number().int().nonnegative(),
});
export type MessageList = z.infer<typeof MessageListSchema>;

/** Filters accepted by the list endpoint and by the store. */
export const MessageFilterSchema = z.object({
  to: z.string().optional(),
  subject: z.string().optional(),
});
export type MessageFilter = z.infer<typeof MessageFilterSchema>;
