import { z } from 'zod';

/** Our own words for where an e-mail is: waiting to go (or to be tried again), sent, or given up on. */
export const outboxStatuses = ['waiting', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof outboxStatuses)[number];

export const outboxStatusLabels: Record<OutboxStatus, string> = {
  waiting: 'Waiting to send',
  sent: 'Sent',
  failed: 'Failed',
};

/** What caused an e-mail; each place in the product that sends mail has its own kind. */
export const mailKinds = [
  'invite',
  'password_reset',
  'application_received',
  'offer',
  'welcome_holder',
  'renewal',
  'payment_receipt',
  'club_news',
  'shift_taken',
  'shift_reminder',
  'shift_released',
  'shift_called_off',
  'shift_digest',
  'shift_help',
  'club_signup',
] as const;
export type MailKind = (typeof mailKinds)[number];

export const mailKindLabels: Record<MailKind, string> = {
  invite: 'Invitation',
  club_signup: 'New club address check',
  password_reset: 'Password link',
  application_received: 'Waiting list confirmation',
  offer: 'Plot offer',
  welcome_holder: 'Welcome to a plot',
  renewal: 'Renewal',
  payment_receipt: 'Payment receipt',
  club_news: 'Club message',
  shift_taken: 'Shift taken',
  shift_reminder: 'Shift reminder',
  shift_released: 'Place given back',
  shift_called_off: 'Shift called off',
  shift_digest: 'Weekly open shifts',
  shift_help: 'Help asked for a shift',
};

export const OutboxQuerySchema = z.strictObject({
  status: z.enum([...outboxStatuses, 'all']).default('all'),
  page: z.coerce.number().int('A whole page number').min(1, 'Pages start at 1').default(1),
});
export type OutboxQuery = z.infer<typeof OutboxQuerySchema>;

/** One e-mail in a club's outgoing mail, as the coordinator's list shows it (no body). */
export const OutboxMessageSchema = z.object({
  id: z.number().int(),
  kind: z.enum(mailKinds),
  to: z.string(),
  subject: z.string(),
  status: z.enum(outboxStatuses),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type OutboxMessage = z.infer<typeof OutboxMessageSchema>;

export const OutboxListSchema = z.object({
  items: z.array(OutboxMessageSchema),
  page: z.number().int(),
  total: z.number().int(),
  /** How many of the club's messages are failed, whatever the filter shows. */
  failed: z.number().int(),
});
export type OutboxList = z.infer<typeof OutboxListSchema>;
