import { z } from 'zod';
import { EmailSchema, textSchema } from './common';
import { isTimeZone } from '../dates';

export const currencies = ['GBP', 'EUR', 'USD', 'CAD', 'AUD', 'NZD'] as const;

/** The spring-round rules a club sets for itself. */
export const ClubSettingsSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  slug: z.string(),
  currency: z.enum(currencies),
  offerDays: z.number().int().min(1, 'At least 1 day').max(60, 'At most 60 days'),
  renewalDays: z.number().int().min(1, 'At least 1 day').max(90, 'At most 90 days'),
  declinedOfferPolicy: z.enum(['end_of_list', 'remove']),
  allowMultipleOffers: z.boolean(),
  /** Every date and time the club's people see is shown in this zone; it starts as the club's first site's. */
  timeZone: z.string().refine(isTimeZone, 'Unknown time zone (use a name like Europe/London)'),
  /** Where replies to the club's e-mails go (their Reply-To); null until a coordinator sets it. */
  contactEmail: z.string().nullable(),
  /** What a plot costs, in the club's words, shown on the public application form. */
  feeNote: z.string().nullable(),
  /** How long people usually wait for a plot, in the club's words, shown on the application form. */
  typicalWait: z.string().nullable(),
  /** Years a botanical family stays out of the same soil when no soil-borne disease has been seen. */
  rotationGapYears: z.number('Enter a whole number of years').int('A whole number of years').min(1, 'At least 1 year').max(10, 'At most 10 years'),
  /** True when plot holders may read each other's plot books (coordinators always can). */
  sharesPlotBooks: z.boolean('true or false'),
  /**
   * How much more water a raised bed and a container need than open ground, as multipliers of the
   * need (our own defaults 1.2 and 1.5; common practice that they dry faster, the figures are the club's).
   */
  raisedBedWaterFactor: z.number('Enter a number like 1.2').min(1, 'At least 1 (the same as open ground)').max(3, 'At most 3'),
  containerWaterFactor: z.number('Enter a number like 1.5').min(1, 'At least 1 (the same as open ground)').max(3, 'At most 3'),
  /** Hours each volunteer is asked to give per season (null: the club asks for no set number). */
  volunteerHoursRequired: z.number('Hours, like 10').min(0).max(500).nullable(),
  /** True once a fee is recorded: the currency can no longer change (read only). */
  currencyLocked: z.boolean(),
});
export type ClubSettings = z.infer<typeof ClubSettingsSchema>;

export const ClubSettingsUpdateBodySchema = ClubSettingsSchema.omit({ id: true, slug: true, currencyLocked: true })
  .extend({
    name: textSchema({ min: 1, minMessage: 'Enter a name', max: 160 }),
    contactEmail: EmailSchema.nullable(),
    feeNote: textSchema({ max: 200 }).nullable(),
    typicalWait: textSchema({ max: 200 }).nullable(),
  })
  .partial()
  .strict();
export type ClubSettingsUpdateBody = z.infer<typeof ClubSettingsUpdateBodySchema>;
