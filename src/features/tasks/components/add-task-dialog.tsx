import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { TaskCreateBody } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateSiteTask } from '../api/create-site-task';
import { TaskFormSchema, taskFormDefaults, type TaskFormInput } from '../lib/task-form';
import { kindOrder, kindWords } from '../lib/words';

/** A plot the task can be for, from the site's plots (the map's list). */
export interface TaskPlotOption {
  id: number;
  label: string;
  kind: string;
}

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
  } = useForm<TaskFormInput, unknown, TaskCreateBody>({
    resolver: zodResolver(TaskFormSchema),
    defaultValues: taskFormDefaults(today),
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
