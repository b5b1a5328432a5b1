import { z } from 'zod';
import { dateWithinSchema, IdSchema, IdTextSchema, textSchema, VersionSchema } from './common';
import { taskKinds } from './labels';

// The season's care as tasks: generated from plantings, the crop notes and the weather log, plus the
// tasks coordinators add for shared beds and the site. Dates are calendar dates in the site's zone;
// water amounts are stored in millimetres and litres and shown in the site's units.

export { taskKinds } from './labels';
export const TaskKindSchema = z.enum(taskKinds);
export type TaskKind = z.infer<typeof TaskKindSchema>;

/** open: to do; done: someone did it; skipped: a coordinator or the holder said it is not needed. */
export const taskStatuses = ['open', 'done', 'skipped'] as const;
export const TaskStatusSchema = z.enum(taskStatuses);

/** generated: from a planting (the generator owns it until it is done); coordinator: added by hand. */
export const taskOrigins = ['generated', 'coordinator'] as const;

/** One task as the API answers it. */
export const TaskSchema = z.object({
  id: z.number().int(),
  siteId: z.number().int(),
  plotId: z.number().int().nullable(),
  plotLabel: z.string().nullable(),
  plantingId: z.number().int().nullable(),
  cropName: z.string().nullable(),
  kind: TaskKindSchema,
  origin: z.enum(taskOrigins),
  title: z.string(),
  /** The task explained with its numbers, e.g. the week's need, rain logged and deficit. */
  details: z.string(),
  /** Where the rule or the figures come from, in words. */
  source: z.string(),
  /** Shown where the task involves fertiliser, sprays, tools, heat or lifting. */
  caution: z.string().nullable(),
  dueOn: z.string(),
  windowFrom: z.string(),
  windowTo: z.string(),
  /** Water tasks: depth in mm and volume in litres for the area planted (the client shows inches and US gallons on US sites). */
  amountMm: z.number().nullable(),
  amountL: z.number().nullable(),
  status: TaskStatusSchema,
  /** Handed to the volunteers: the holder is away and asked for cover. */
  forVolunteers: z.boolean(),
  doneOn: z.string().nullable(),
  version: z.number().int(),
});
export type TaskView = z.infer<typeof TaskSchema>;

/** GET /api/plots/:plotId/tasks: a plot's open tasks grouped for its plot book, and the last done ones. */
export const PlotTasksSchema = z.object({
  today: z.string(),
  units: z.enum(['metric', 'us']),
  overdue: z.array(TaskSchema),
  thisWeek: z.array(TaskSchema),
  nextWeek: z.array(TaskSchema),
  later: z.array(TaskSchema),
  recentlyDone: z.array(TaskSchema),
  handovers: z.array(
    z.object({ id: z.number().int(), fromOn: z.string(), toOn: z.string(), kinds: z.array(TaskKindSchema), note: z.string() }),
  ),
  canWrite: z.boolean(),
});
export type PlotTasks = z.infer<typeof PlotTasksSchema>;

const taskDate = dateWithinSchema({ earliest: '2000-01-01', daysAhead: 800, message: 'Use a date like 2027-06-12', tooLateMessage: 'At most about two years ahead' });

/** GET /api/sites/:siteId/tasks?from=&to=&kind=&plotId=&status= (coordinators). */
export const SiteTaskQuerySchema = z.object({
  from: taskDate.optional(),
  to: taskDate.optional(),
  kind: TaskKindSchema.optional(),
  plotId: IdTextSchema.optional(),
  status: TaskStatusSchema.optional(),
});
export type SiteTaskQuery = z.infer<typeof SiteTaskQuerySchema>;
export const SiteTaskListSchema = z.object({ today: z.string(), units: z.enum(['metric', 'us']), items: z.array(TaskSchema) });
export type SiteTaskList = z.infer<typeof SiteTaskListSchema>;

/** POST /api/tasks/:taskId/done and /reopen and /skip: the version last read; a note is kept with a done task. */
export const TaskStatusBodySchema = z.strictObject({ version: VersionSchema, note: textSchema({ max: 500, multiline: true }).default('') });

/** POST /api/sites/:siteId/tasks: a coordinator's task for a shared bed or the site, once or repeating. */
export const TaskCreateBodySchema = z
  .strictObject({
    plotId: IdSchema.nullable().default(null),
    kind: TaskKindSchema.default('other'),
    title: textSchema({ min: 1, max: 120 }),
    details: textSchema({ max: 2000, multiline: true }).default(''),
    dueOn: taskDate,
    /** Days the task can be done in, from its due date (1 = that day only). */
    windowDays: z.number().int('A whole number of days').min(1, 'At least 1 day').max(60, 'At most 60 days').default(7),
    /** Repeat every so many days until `repeatUntil`; null for a one-off task. */
    repeatEveryDays: z.number().int('A whole number of days').min(1, 'At least every day').max(90, 'At most every 90 days').nullable().default(null),
    repeatUntil: taskDate.nullable().default(null),
  })
  .refine((b) => (b.repeatEveryDays === null) === (b.repeatUntil === null), { message: 'Give how often and until when, or neither', path: ['repeatUntil'] })
  .refine((b) => b.repeatUntil === null || b.repeatUntil >= b.dueOn, { message: 'Must be on or after the first date', path: ['repeatUntil'] });
export type TaskCreateBody = z.infer<typeof TaskCreateBodySchema>;

/** POST /api/plots/:plotId/handovers: "I am away from … to …: cover my watering". */
export const HandoverBodySchema = z
  .strictObject({
    fromOn: taskDate,
    toOn: taskDate,
    kinds: z.array(TaskKindSchema).min(1, 'Choose at least one kind of task').max(taskKinds.length).default(['water']),
    note: textSchema({ max: 500, multiline: true }).default(''),
  })
  .refine((b) => b.toOn >= b.fromOn, { message: 'Must be on or after the first day away', path: ['toOn'] })
  .refine((b) => new Set(b.kinds).size === b.kinds.length, { message: 'Name each kind once', path: ['kinds'] });
export type HandoverBody = z.infer<typeof HandoverBodySchema>;

/** POST /api/sites/:siteId/task-runs answers a run; GET /api/task-runs/:runId shows how far it got. */
export const TaskRunSchema = z.object({
  id: z.number().int(),
  siteId: z.number().int(),
  status: z.enum(['queued', 'running', 'done', 'failed']),
  total: z.number().int(),
  done: z.number().int(),
  created: z.number().int(),
  updated: z.number().int(),
  removed: z.number().int(),
  error: z.string().nullable(),
});
export type TaskRun = z.infer<typeof TaskRunSchema>;

/** GET /api/sites/:siteId/water?weeks=: this week's need, rain and deficit per plot, and the past weeks for a chart. */
export const WaterWeekSchema = z.object({
  weekStart: z.string(),
  needMm: z.number(),
  rainMm: z.number(),
  deficitMm: z.number(),
  litres: z.number(),
  /** Penman-Monteith, Hargreaves or the rule of thumb: how many days each. */
  methods: z.record(z.string(), z.number()),
});
export const WaterSummarySchema = z.object({
  today: z.string(),
  units: z.enum(['metric', 'us']),
  weeks: z.array(WaterWeekSchema),
  plots: z.array(
    z.object({
      plotId: z.number().int(),
      plotLabel: z.string(),
      areaM2: z.number(),
      needMm: z.number(),
      rainMm: z.number(),
      deficitMm: z.number(),
      litres: z.number(),
      crops: z.array(z.string()),
    }),
  ),
});
export type WaterSummary = z.infer<typeof WaterSummarySchema>;
export const WaterQuerySchema = z.object({ weeks: z.coerce.number('A number of weeks').int('A whole number of weeks').min(1, 'At least 1 week').max(26, 'At most 26 weeks').default(8) });

