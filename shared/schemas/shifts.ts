import { z } from 'zod';
import { IdSchema, textSchema, VersionSchema } from './common';
import { TaskKindSchema, TaskSchema } from './tasks';

// Shifts: open tasks for one date and time window at one site, grouped so volunteers can take them on
// together. Dates and times are the site's own (its time zone); instants travel as ISO strings.

/** A shift is about one kind of task, or several ("mixed", e.g. a work day). */
export const shiftKinds = [...TaskKindSchema.options, 'mixed'] as const;
export const ShiftKindSchema = z.enum(shiftKinds);
export type ShiftKind = z.infer<typeof ShiftKindSchema>;

/**
 * Where a shift stands, worked out from its places and its time: `needs_people` has places left,
 * `covered` has every place taken, `done` has someone who marked it done, `not_done` ended with
 * nobody marking it done, `called_off` was cancelled by a coordinator.
 */
export const shiftStates = ['needs_people', 'covered', 'done', 'not_done', 'called_off'] as const;
export const ShiftStateSchema = z.enum(shiftStates);
export type ShiftState = z.infer<typeof ShiftStateSchema>;

/** One person's place on a shift: `taken` until they did it (`done`), gave it back (`released`) or the shift ended (`missed`). */
export const claimStatuses = ['taken', 'done', 'released', 'missed'] as const;
export const ClaimStatusSchema = z.enum(claimStatuses);
export type ClaimStatus = z.infer<typeof ClaimStatusSchema>;

const TIME_MESSAGE = 'A time like 18:00';
export const TimeOfDaySchema = z.string(TIME_MESSAGE).regex(/^([01]\d|2[0-3]):[0-5]\d$/, TIME_MESSAGE);

export const ShiftPersonSchema = z.object({
  claimId: z.number().int(),
  userId: z.number().int(),
  name: z.string(),
  status: ClaimStatusSchema,
  hours: z.number().nullable(),
  note: z.string(),
  hasPhoto: z.boolean(),
});
export type ShiftPerson = z.infer<typeof ShiftPersonSchema>;

/** A shift as the board shows it. `people` names who took places: coordinators only (null for everyone else). */
export const ShiftSchema = z.object({
  id: z.number().int(),
  siteId: z.number().int(),
  siteName: z.string(),
  timeZone: z.string(),
  units: z.enum(['metric', 'us']),
  title: z.string(),
  kind: ShiftKindSchema,
  /** The site's calendar date and wall-clock times. */
  date: z.string(),
  startTime: z.string(),
  endTime: z.string(),
  startsAt: z.string(),
  endsAt: z.string(),
  capacity: z.number().int(),
  taken: z.number().int(),
  estHours: z.number(),
  instructions: z.string(),
  /** The usual cautions for the kinds of work in the shift, always shown. */
  caution: z.string(),
  state: ShiftStateSchema,
  taskCount: z.number().int(),
  plotLabels: z.array(z.string()),
  /** The water the shift's tasks ask for, in litres (null when none are watering). */
  amountL: z.number().nullable(),
  myClaim: z.object({ id: z.number().int(), status: ClaimStatusSchema }).nullable(),
  people: z.array(ShiftPersonSchema).nullable(),
  version: z.number().int(),
});
export type Shift = z.infer<typeof ShiftSchema>;

export const ShiftDetailSchema = ShiftSchema.extend({ tasks: z.array(TaskSchema) });
export type ShiftDetail = z.infer<typeof ShiftDetailSchema>;

export const ShiftListSchema = z.object({ items: z.array(ShiftSchema), from: z.string(), to: z.string() });
export type ShiftList = z.infer<typeof ShiftListSchema>;

const dateText = (message: string) => z.iso.date(message);

/** GET /api/clubs/:clubId/shifts: the board for a range of the sites' dates (at most 92 days). */
export const ShiftQuerySchema = z
  .object({
    from: dateText('A date like 2026-07-06').optional(),
    to: dateText('A date like 2026-07-12').optional(),
    siteId: z.coerce.number('Choose a site').int().min(1).max(2_147_483_647).optional(),
    kind: ShiftKindSchema.optional(),
    /** Only the shifts that still need people. */
    open: z.enum(['true', 'false']).optional(),
  })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'The end is before the start', path: ['to'] })
  .refine((q) => !q.from || !q.to || Date.parse(q.to) - Date.parse(q.from) <= 92 * 86_400_000, { message: 'At most 92 days at a time', path: ['to'] });
export type ShiftQuery = z.infer<typeof ShiftQuerySchema>;

const shiftFields = {
  siteId: IdSchema,
  title: textSchema({ min: 1, minMessage: 'Give the shift a name', max: 160 }),
  kind: ShiftKindSchema,
  date: dateText('A date like 2026-07-14'),
  startTime: TimeOfDaySchema,
  endTime: TimeOfDaySchema,
  capacity: z.number('How many people').int('A whole number of people').min(1, 'At least 1 person').max(50, 'At most 50 people'),
  estHours: z.number('Hours, like 1.5').min(0.25, 'At least a quarter of an hour').max(12, 'At most 12 hours'),
  instructions: textSchema({ max: 2000, multiline: true }),
  /** The open tasks the shift covers (none for a work day of the coordinator's own). */
  taskIds: z.array(IdSchema).max(500, 'At most 500 tasks in one shift'),
};

const endAfterStart = (b: { startTime?: string; endTime?: string }) => !b.startTime || !b.endTime || b.endTime > b.startTime;

export const ShiftCreateBodySchema = z.strictObject(shiftFields).refine(endAfterStart, { message: 'The end is before the start', path: ['endTime'] });
export type ShiftCreateBody = z.infer<typeof ShiftCreateBodySchema>;

export const ShiftUpdateBodySchema = z
  .strictObject(shiftFields)
  .omit({ siteId: true })
  .partial()
  .extend({ version: VersionSchema })
  .refine(endAfterStart, { message: 'The end is before the start', path: ['endTime'] });
export type ShiftUpdateBody = z.infer<typeof ShiftUpdateBodySchema>;

/** A grouping the server suggests from open tasks: by site, date and kind. */
export const ShiftSuggestionSchema = z.object({
  siteId: z.number().int(),
  siteName: z.string(),
  kind: ShiftKindSchema,
  date: z.string(),
  startTime: z.string(),
  endTime: z.string(),
  title: z.string(),
  taskIds: z.array(z.number().int()),
  plotLabels: z.array(z.string()),
  estHours: z.number(),
  capacity: z.number().int(),
  amountL: z.number().nullable(),
  /** How the hours were estimated, in words. */
  estimate: z.string(),
});
export type ShiftSuggestion = z.infer<typeof ShiftSuggestionSchema>;
export const ShiftSuggestionListSchema = z.object({ items: z.array(ShiftSuggestionSchema), from: z.string(), to: z.string() });

/** POST /api/shifts/:shiftId/done (signed in) or /api/shift-links/done (from the e-mail): how it went. */
export const ShiftDoneBodySchema = z.strictObject({
  note: textSchema({ max: 1000, multiline: true }).default(''),
  /** The hours worked, when not the shift's estimate. */
  hours: z.number('Hours, like 1.5').min(0.25, 'At least a quarter of an hour').max(12, 'At most 12 hours').nullable().default(null),
});
export type ShiftDoneBody = z.infer<typeof ShiftDoneBodySchema>;

export const LinkTokenBodySchema = z.strictObject({
  token: z.string('The link is incomplete').min(20, 'The link is incomplete').max(100, 'The link is not one of ours').regex(/^[A-Za-z0-9_-]+$/, 'The link is not one of ours'),
});

/** What an e-mailed shift link leads to, before anything is confirmed. */
export const shiftLinkStates = ['ready', 'yours', 'full', 'expired', 'used', 'called_off'] as const;
export const ShiftLinkPreviewSchema = z.object({
  purpose: z.enum(['claim', 'release', 'done']),
  state: z.enum(shiftLinkStates),
  /** The first name of the person the link is for, so someone else's forwarded link says whose it is. */
  forName: z.string(),
  clubName: z.string(),
  shift: ShiftSchema,
  /** Shifts at the club that still need people, when this one cannot be claimed. */
  otherShifts: z.array(ShiftSchema),
});
export type ShiftLinkPreview = z.infer<typeof ShiftLinkPreviewSchema>;

export const AskForHelpBodySchema = z.strictObject({
  note: textSchema({ max: 1000, multiline: true }).default(''),
});
export const AskForHelpResultSchema = z.object({ sent: z.number().int(), skipped: z.number().int() });

/** A volunteer's e-mail choices about shifts in one club. `digestDay`: 0 Sunday … 6 Saturday, null for none; `reminders`: the e-mail the day before a shift they hold. */
export const VolunteerSettingsSchema = z.object({
  digestDay: z.number().int().min(0, 'A day of the week').max(6, 'A day of the week').nullable(),
  helpMail: z.boolean('true or false'),
  reminders: z.boolean('true or false'),
});
export type VolunteerSettings = z.infer<typeof VolunteerSettingsSchema>;
export const VolunteerSettingsBodySchema = VolunteerSettingsSchema.partial().strict();

/** Hours done per person in a season, against the club's ask. */
export const HoursRowSchema = z.object({
  userId: z.number().int(),
  name: z.string(),
  shiftsDone: z.number().int(),
  hours: z.number(),
  required: z.number().nullable(),
  /** Hours still to do (0 when met; null when the club asks for none). */
  remaining: z.number().nullable(),
});
export type HoursRow = z.infer<typeof HoursRowSchema>;
export const HoursTableSchema = z.object({ year: z.number().int(), required: z.number().nullable(), items: z.array(HoursRowSchema) });
export type HoursTable = z.infer<typeof HoursTableSchema>;
export const HoursQuerySchema = z.object({ year: z.coerce.number('A year').int().min(2000).max(2100).optional() }).strict();

export const MyShiftsSchema = z.object({
  upcoming: z.array(ShiftSchema),
  past: z.array(ShiftSchema),
  hours: HoursRowSchema,
  year: z.number().int(),
});
export type MyShifts = z.infer<typeof MyShiftsSchema>;

/** A calendar feed's secret address, shown when it is made or reset (only its hash is kept). */
export const FeedUrlSchema = z.object({ url: z.string(), kind: z.enum(['personal', 'club']), createdAt: z.string() });
export const FeedStatusSchema = z.object({ personal: z.object({ createdAt: z.string() }).nullable(), club: z.object({ createdAt: z.string() }).nullable() });
