import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { TaskCreateBodySchema, taskKinds, type TaskCreateBody } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateSiteTask } from '../api/create-site-task';
import { kindOrder, kindWords } from '../lib/words';

/** A plot the task can be for, from the site's plots (the map's list). */
export interface TaskPlotOption {
  id: number;
  label: string;
  kind: string;
}

const wholeNumber = (text: string) => (text.trim() === '' ? null : Number(text.trim()));

// The boxes hold text; the shared body schema then checks the values as the server will, and its messages land on the same boxes.
const FormSchema = z
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
    if (bad.length > 0 || missing.length > 0) return z.NEVER;
    const body = TaskCreateBodySchema.safeParse({
      plotId: v.plotId ? Number(v.plotId) : null,
      kind: v.kind,
      title: v.title,
      details: v.details,
      dueOn: v.dueOn,
      windowDays: wholeNumber(v.windowDays) ?? undefined,
      repeatEveryDays: v.repeat ? wholeNumber(v.repeatEveryDays) : null,
      repeatUntil: v.repeat ? v.repeatUntil || null : null,
    });
    if (body.success) return body.data;
    for (const issue of body.error.issues) {
      ctx.addIssue({ code: 'custom', path: [String(issue.path[0] ?? 'title')], message: issue.message });
    }
    return z.NEVER;
  });
type FormInput = z.input<typeof FormSchema>;
const fieldNames = ['plotId', 'kind', 'title', 'details', 'dueOn', 'windowDays', 'repeatEveryDays', 'repeatUntil'] as const;

function AddTaskForm({
  siteId,
  plots,
  today,
  onDone,
  onCancel,
}: {
  siteId: number;
  plots: readonly TaskPlotOption[];
  today: string;
  onDone: (created: number) => void;
  onCancel: () => void;
}) {
  const create = useCreateSiteTask(siteId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    control,
    setError,
    formState: { errors },
  } = useForm<FormInput, unknown, TaskCreateBody>({
    resolver: zodResolver(FormSchema),
    defaultValues: { plotId: '', kind: 'other', title: '', details: '', dueOn: today, windowDays: '7', repeat: false, repeatEveryDays: '7', repeatUntil: '' },
  });
  const repeat = useWatch({ control, name: 'repeat' });
  const shared = plots.filter((p) => p.kind === 'shared_bed');
  const others = plots.filter((p) => p.kind !== 'shared_bed');

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    create.mutate(body, {
      onSuccess: (answer) => onDone(answer.created),
      onError: (error) => setFormError(applyServerErrors(error, setError, fieldNames)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <Select label="Where" hint="A shared bed, or the whole site (paths, compost, the shed)." error={errors.plotId?.message} {...register('plotId')}>
        <option value="">The whole site</option>
        {shared.length > 0 && (
          <optgroup label="Shared beds">
            {shared.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label}
              </option>
            ))}
          </optgroup>
        )}
        {others.length > 0 && (
          <optgroup label="Holders’ plots">
            {others.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label}
              </option>
            ))}
          </optgroup>
        )}
      </Select>
      <Select label="Kind" error={errors.kind?.message} {...register('kind')}>
        {kindOrder.map((k) => (
          <option key={k} value={k}>
            {kindWords[k]}
          </option>
        ))}
      </Select>
      <TextField label="Title" maxLength={120} autoComplete="off" error={errors.title?.message} {...register('title')} />
      <TextAreaField
        label="Details (optional)"
        hint="What to do and what to use, for whoever picks it up. If it involves sprays, feeds, power tools, heat or heavy lifting, say what to wear and to follow the product’s label and the club’s rules."
        rows={3}
        maxLength={2000}
        error={errors.details?.message}
        {...register('details')}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Due" type="date" hint="The first date, when it repeats." error={errors.dueOn?.message} {...register('dueOn')} />
        <TextField
          label="Days to do it in"
          inputMode="numeric"
          hint="From the due date; 1 is that day only."
          error={errors.windowDays?.message}
          {...register('windowDays')}
        />
      </div>
      <Checkbox label="Repeat it" hint="The same task again every so many days, until a date (at most 200 times)." {...register('repeat')} />
      {repeat && (
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Every how many days" inputMode="numeric" error={errors.repeatEveryDays?.message} {...register('repeatEveryDays')} />
          <TextField label="Until" type="date" error={errors.repeatUntil?.message} {...register('repeatUntil')} />
        </div>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={create.isPending} loadingText="Adding…">
          Add the task
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export interface AddTaskDialogProps {
  open: boolean;
  siteId: number;
  siteName: string;
  plots: readonly TaskPlotOption[];
  /** The site's today, the due date offered first. */
  today: string;
  onClose: () => void;
  onDone: (created: number) => void;
}

/** "Add a task": a coordinator's job for a shared bed or the whole site, once or repeating. */
export function AddTaskDialog({ open, siteId, siteName, plots, today, onClose, onDone }: AddTaskDialogProps) {
  return (
    <Dialog open={open} onClose={onClose} title="Add a task" description={`A job at ${siteName} for a shared bed or the whole site, once or repeating.`}>
      {open && <AddTaskForm siteId={siteId} plots={plots} today={today} onDone={onDone} onCancel={onClose} />}
    </Dialog>
  );
}
