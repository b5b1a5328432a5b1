import { z } from 'zod';
import { TaskCreateBodySchema, taskKinds, type TaskCreateBody } from '@shared/schemas/tasks';

// The "Add a task" form: its boxes as text, turned into the body the server takes.

const wholeNumber = (text: string) => (text.trim() === '' ? null : Number(text.trim()));

// The boxes hold text; the shared body schema then checks the values as the server will, and its messages land on the same boxes.
export const TaskFormSchema = z
  .object({
    plotId: z.string(),
    kind: z.enum(taskKinds),
    title: z.string(),
    details: z.string(),
    dueOn: z.string(),
    windowDays: z.string(),
    repeat: z.boolean(),
    repeatEveryDays: z.string(),
    repeatUntil: z.string(),
  })
  .transform((v, ctx): TaskCreateBody => {
    // Text that is not a whole number gets the server's words for it, not a parser's.
    const counts = [['windowDays', v.windowDays], ...(v.repeat ? [['repeatEveryDays', v.repeatEveryDays]] : [])] as const;
    const bad = counts.filter(([, text]) => text.trim() !== '' && !/^\d+$/.test(text.trim()));
    for (const [field] of bad) ctx.addIssue({ code: 'custom', path: [field], message: 'A whole number of days' });
    // A repeat needs both how often and until when; each empty box says what it is missing.
    const missing: Array<[string, string]> = [];
    if (v.repeat && v.repeatEveryDays.trim() === '') missing.push(['repeatEveryDays', 'Say how many days apart']);
    if (v.repeat && v.repeatUntil.trim() === '') missing.push(['repeatUntil', 'Give the last date it may fall on']);
    for (const [field, message] of missing) ctx.addIssue({ code: 'custom', path: [field], message });
    // The other boxes are still checked, so every mistake shows at once; a box keeps the first message it got.
    const flagged = new Set<string>([...bad.map(([field]) => field), ...missing.map(([field]) => field)]);
    const number = (field: string, text: string) => (flagged.has(field) ? null : wholeNumber(text));
    const repeatChecked = v.repeat && !flagged.has('repeatEveryDays') && !flagged.has('repeatUntil');
    const body = TaskCreateBodySchema.safeParse({
      plotId: v.plotId ? Number(v.plotId) : null,
      kind: v.kind,
      title: v.title,
      details: v.details,
      dueOn: v.dueOn,
      windowDays: number('windowDays', v.windowDays) ?? undefined,
      // A repeat with either box flagged is checked as no repeat, so the pair's rule does not blame the other box.
      repeatEveryDays: repeatChecked ? number('repeatEveryDays', v.repeatEveryDays) : null,
      repeatUntil: repeatChecked ? v.repeatUntil || null : null,
    });
    if (body.success && flagged.size === 0) return body.data;
    for (const issue of body.success ? [] : body.error.issues) {
      const field = String(issue.path[0] ?? 'title');
      if (flagged.has(field)) continue;
      flagged.add(field);
      ctx.addIssue({ code: 'custom', path: [field], message: issue.message });
    }
    return z.NEVER;
  });
export type TaskFormInput = z.input<typeof TaskFormSchema>;

/** What the form starts with: a one-off task for the whole site, due on the site's today, a week to do it in. */
export function taskFormDefaults(today: string): TaskFormInput {
  return { plotId: '', kind: 'other', title: '', details: '', dueOn: today, windowDays: '7', repeat: false, repeatEveryDays: '7', repeatUntil: '' };
}
