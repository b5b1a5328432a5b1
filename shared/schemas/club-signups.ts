import { z } from 'zod';
import { EmailSchema, PasswordSchema, textSchema } from './common';
import { currencies } from './clubs';
import { SessionUserSchema } from './auth';
import { UnitsSchema } from './sites';
import { isTimeZone } from '../dates';

/** POST /api/club-signups: a club's first coordinator, and the club they start. */
export const ClubSignupBodySchema = z.strictObject({
  name: textSchema({ min: 1, minMessage: 'Enter your name', max: 120 }),
  email: EmailSchema,
  password: PasswordSchema,
  clubName: textSchema({ min: 2, minMessage: 'Enter the club’s name', max: 120 }),
  timeZone: z.string().max(64).refine(isTimeZone, 'Unknown time zone (use a name like Europe/London)'),
  currency: z.enum(currencies, 'Choose a currency'),
  units: UnitsSchema,
});
export type ClubSignupBody = z.infer<typeof ClubSignupBodySchema>;

export const ClubSignupTokenSchema = z.strictObject({ token: z.string().min(20).max(200) });
export type ClubSignupToken = z.infer<typeof ClubSignupTokenSchema>;

/** GET /api/club-signups/check?token=…: a working link, without using it. */
export const ClubSignupCheckSchema = z.object({ clubName: z.string(), email: z.string() });
export type ClubSignupCheck = z.infer<typeof ClubSignupCheckSchema>;

/**
 * POST /api/club-signups/confirm: the club made. A new account is signed in (`user` and `csrfToken`); an
 * address that already had an account gets the club added and is told to sign in with its own password.
 */
export const ClubSignupResultSchema = z.object({
  clubId: z.number().int(),
  clubSlug: z.string(),
  existingAccount: z.boolean(),
  user: SessionUserSchema.nullable(),
  csrfToken: z.string().nullable(),
});
export type ClubSignupResult = z.infer<typeof ClubSignupResultSchema>;

export const checklistSteps = ['site', 'plots', 'members', 'waitlist', 'fees', 'season'] as const;
export type ChecklistStep = (typeof checklistSteps)[number];

/** GET /api/clubs/:clubId/checklist (coordinators): each first-run step, done or not, from the club's data. */
export const ClubChecklistSchema = z.object({
  hidden: z.boolean(),
  steps: z.array(z.object({ key: z.enum(checklistSteps), done: z.boolean() })),
});
export type ClubChecklist = z.infer<typeof ClubChecklistSchema>;

/** PATCH /api/clubs/:clubId/checklist: hide the checklist from the home, or bring it back. */
export const ClubChecklistBodySchema = z.strictObject({ hidden: z.boolean('true or false') });
export type ClubChecklistBody = z.infer<typeof ClubChecklistBodySchema>;
