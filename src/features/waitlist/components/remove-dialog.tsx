import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ApplicationRemoveBodySchema, type WaitlistEntry } from '@shared/schemas/applications';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useRemoveApplication } from '../api/remove-application';

function RemoveForm({ entry, onDone }: { entry: WaitlistEntry; onDone: (message: string) => void }) {
  const remove = useRemoveApplication();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(ApplicationRemoveBodySchema), defaultValues: { reason: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    remove.mutate(
      { applicationId: entry.id, body: values },
      {
        onSuccess: () => onDone(`${entry.name} is off the waiting list; everyone behind moved up one.`),
        onError: (error) => setFormError(applyServerErrors(error, setError, ['reason'])),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextAreaField label="Reason" hint="For example: asked to leave, moved away, no answer to letters." error={errors.reason?.message} rows={3} {...register('reason')} />
      <Button type="submit" variant="danger" loading={remove.isPending} loadingText="Removing…" className="self-start">
        Remove from the waiting list
      </Button>
    </form>
  );
}

/** Asks for the reason, then takes the person off the waiting list. */
export function RemoveDialog({
  entry,
  onClose,
  onDone,
}: {
  entry: WaitlistEntry | null;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  return (
    <Dialog
      open={entry !== null}
      onClose={onClose}
      title={entry ? `Remove ${entry.name}?` : 'Remove'}
      description="They stay in the records with the reason, but leave the queue. If they apply again, they start at the back."
    >
      {entry && <RemoveForm key={entry.id} entry={entry} onDone={onDone} />}
    </Dialog>
  );
}
