import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { WaitlistMoveBodySchema, type WaitlistEntry } from '@shared/schemas/applications';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField, TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useMoveApplication } from '../api/move-application';

function MoveForm({ entry, waiting, onDone }: { entry: WaitlistEntry; waiting: number; onDone: (message: string) => void }) {
  const move = useMoveApplication();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(WaitlistMoveBodySchema),
    defaultValues: { toPosition: entry.position ?? 1, reason: '' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    move.mutate(
      { applicationId: entry.id, body: values },
      {
        onSuccess: (moved) => onDone(`${entry.name} is now number ${moved.position}.`),
        onError: (error) => setFormError(applyServerErrors(error, setError, ['toPosition', 'reason'])),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="New place"
        type="number"
        inputMode="numeric"
        min={1}
        max={waiting}
        hint={`1 is next in line; ${waiting} ${waiting === 1 ? 'person is' : 'people are'} waiting.`}
        error={errors.toPosition?.message}
        {...register('toPosition', { valueAsNumber: true })}
      />
      <TextAreaField label="Reason" hint="Kept in their history, with your name and the date." error={errors.reason?.message} rows={3} {...register('reason')} />
      <Button type="submit" loading={move.isPending} loadingText="Moving…" className="self-start">
        Move
      </Button>
    </form>
  );
}

/** Asks for the new place and the reason, then moves the person in the queue. */
export function MoveDialog({
  entry,
  waiting,
  onClose,
  onDone,
}: {
  entry: WaitlistEntry | null;
  waiting: number;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  return (
    <Dialog
      open={entry !== null}
      onClose={onClose}
      title={entry ? `Move ${entry.name}` : 'Move'}
      description={entry ? `Now number ${entry.position}. Everyone between the old and new place shifts by one.` : undefined}
    >
      {entry && <MoveForm key={entry.id} entry={entry} waiting={waiting} onDone={onDone} />}
    </Dialog>
  );
}
