import { z } from 'zod';
import { EmailSchema, IdSchema, IdTextSchema, MAX_INT4, textSchema } from './common';

export const preferredSizes = ['small', 'medium', 'large', 'any'] as const;
export const PreferredSizeSchema = z.enum(preferredSizes);
export const preferredSizeLabels: Record<(typeof preferredSizes)[number], string> = {
  small: 'Small (a raised bed or half plot)',
  medium: 'Medium (about 3 × 6 m / 10 × 20 ft)',
  large: 'Large (a full plot or more)',
  any: 'Any size',
};

export const applicationStatuses = ['waiting', 'offered', 'allocated', 'removed', 'withdrawn'] as const;
export const ApplicationStatusSchema = z.enum(applicationStatuses);

/** The public "apply for a plot" form. `website` is a honeypot: people leave it empty, bots fill it. */
export const ApplicationBodySchema = z.strictObject({
  name: textSchema({ min: 1, minMessage: 'Enter your name', max: 120 }),
  email: EmailSchema,
  phone: textSchema({ max: 40 }).default(''),
  preferredSize: PreferredSizeSchema.default('any'),
  needsAccessible: z.boolean().default(false),
  needsRaised: z.boolean().default(false),
  preferredSiteId: IdSchema.nullable().default(null),
  notes: textSchema({ max: 1000, multiline: true }).default(''),
  website: textSchema({ max: 200, trim: false }).default(''),
});
export type ApplicationBody = z.infer<typeof ApplicationBodySchema>;

/** What the public form needs to show: the club's name and its sites. */
export const ApplyInfoSchema = z.object({
  clubName: z.string(),
  sites: z.array(z.object({ id: z.number().int(), name: z.string() })),
  /** What a plot costs and how long people wait, in the club's own words (club settings); null when not said. */
  feeNote: z.string().nullable(),
  typicalWait: z.string().nullable(),
});
export type ApplyInfo = z.infer<typeof ApplyInfoSchema>;

export const ApplicationReceiptSchema = z.object({ position: z.number().int(), message: z.string() });

/** One person on the waiting list as the coordinator sees them. */
export const WaitlistEntrySchema = z.object({
  id: z.number().int(),
  position: z.number().int().nullable(),
  name: z.string(),
  email: z.string(),
  phone: z.string(),
  preferredSize: PreferredSizeSchema,
  needsAccessible: z.boolean(),
  needsRaised: z.boolean(),
  preferredSiteId: z.number().int().nullable(),
  preferredSiteName: z.string().nullable(),
  notes: z.string(),
  status: ApplicationStatusSchema,
  appliedAt: z.string(),
  waitedDays: z.number().int(),
});
export type WaitlistEntry = z.infer<typeof WaitlistEntrySchema>;

export const WaitlistQuerySchema = z.object({
  status: z.enum(['waiting', 'offered', 'all']).default('waiting'),
  needs: z.enum(['accessible', 'raised']).optional(),
  siteId: IdTextSchema.optional(),
});

/** Moving someone in the queue always needs a reason, which is kept. */
export const WaitlistMoveBodySchema = z.strictObject({
  toPosition: z.number().int().min(1, 'Positions start at 1').max(MAX_INT4, 'No queue is that long'),
  reason: textSchema({ min: 3, minMessage: 'Give a reason (it is kept in the record)', max: 300, multiline: true }),
});

export const ApplicationRemoveBodySchema = z.strictObject({
  reason: textSchema({ min: 3, minMessage: 'Give a reason (it is kept in the record)', max: 200, multiline: true }),
});
