import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { HandoverBodySchema, type HandoverBody } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox, CheckboxGroup } from '@/components/ui/checkbox';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField, TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateHandover, type HandoverCreated } from '../api/create-handover';
import { addDaysTo } from '../lib/dates';
import { kindOrder, kindWords } from '../lib/words';

type FormInput = z.input<typeof HandoverBodySchema>;
const fieldNames = ['fromOn', 'toOn', 'kinds', 'note'] as const;

function HandoverForm({ plotId, today, onDone, onCancel }: { plotId: number; today: string; onDone: (h: HandoverCreated) => void; onCancel: () => void }) {
  const create = useCreateHandover(plotId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FormInput, unknown, HandoverBody>({
    resolver: zodResolver(HandoverBodySchema),
    // A week away from today is the usual ask; watering is what most needs cover.
    defaultValues: { fromOn: today, toOn: addDaysTo(today, 6), kinds: ['water'], note: '' },
  });

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    create.mutate(body, {
      onSuccess: onDone,
      onError: (error) => setFormError(applyServerErrors(error, setError, fieldNames)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="First day away" type="date" error={errors.fromOn?.message} {...register('fromOn')} />
        <TextField label="Last day away" type="date" error={errors.toOn?.message} {...register('toOn')} />
      </div>
      <CheckboxGroup legend="Which tasks should the volunteers cover?" error={errors.kinds?.message ?? errors.kinds?.root?.message}>
        {kindOrder.map((kind) => (
          <Checkbox key={kind} label={kindWords[kind]} value={kind} {...register('kinds')} />
        ))}
      </CheckboxGroup>
      <TextAreaField
        label="Note for the volunteers (optional)"
        hint="Where the can or hose is, what needs most care."
        rows={3}
        maxLength={500}
        error={errors.note?.message}
        {...register('note')}
      />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={create.isPending} loadingText="Asking…">
          Ask the volunteers
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export interface HandoverDialogProps {
  open: boolean;
  plotId: number;
  plotLabel?: string;
  /** The site's today, the first day offered. */
  today: string;
  onClose: () => void;
  onDone: (handover: HandoverCreated) => void;
}

/** "Away? Ask the volunteers to cover": the days away, which kinds of task, and a note. */
export function HandoverDialog({ open, plotId, plotLabel, today, onClose, onDone }: HandoverDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Ask the volunteers to cover"
      description={`While you are away, the chosen tasks on ${plotLabel ? `plot ${plotLabel}` : 'your plot'} go to the club's volunteers. You can cancel this at any time.`}
    >
      {open && <HandoverForm plotId={plotId} today={today} onDone={onDone} onCancel={onClose} />}
    </Dialog>
  );
}
