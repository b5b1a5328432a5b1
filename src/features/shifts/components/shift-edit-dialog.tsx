import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Shift } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useUpdateShift } from '../api/update-shift';
import { ShiftDetailsFormSchema, shiftFormFieldNames, shiftFormValues, type ShiftDetailsChecked, type ShiftFormValues } from '../lib/shift-form';
import { ShiftFields } from './shift-fields';

/** Said after a 409: someone saved the shift first; the page shows theirs, the form keeps what was typed. */
export const SHIFT_CHANGED_MESSAGE =
  'Someone else changed this shift since you opened it, and the page now shows their version. Your changes are still in the form: check them and save again to keep yours.';

function EditForm({ shift, onSaved, onCancel }: { shift: Shift; onSaved: () => void; onCancel: () => void }) {
  const update = useUpdateShift(shift.id);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ShiftFormValues, unknown, ShiftDetailsChecked>({ resolver: zodResolver(ShiftDetailsFormSchema), defaultValues: shiftFormValues(shift) });

  const onSubmit = handleSubmit((details) => {
    setFormError(null);
    // The version is the newest this page has read: after a 409 that is the other person's, so saving again is a choice.
    update.mutate(
      { ...details, version: shift.version },
      {
        onSuccess: onSaved,
        onError: (error) => setFormError(isApiError(error, 409) ? SHIFT_CHANGED_MESSAGE : applyServerErrors(error, setError, shiftFormFieldNames)),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <ShiftFields register={register} errors={errors} show={{ kind: true, date: true }} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={update.isPending} loadingText="Saving…">
          Save the shift
        </Button>
        <Button variant="ghost" onClick={onCancel} disabled={update.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export interface ShiftEditDialogProps {
  open: boolean;
  shift: Shift;
  onClose: () => void;
  onSaved: () => void;
}

/** "Edit the shift": its name, kind, date, times, places, hours and instructions. */
export function ShiftEditDialog({ open, shift, onClose, onSaved }: ShiftEditDialogProps) {
  return (
    <Dialog open={open} onClose={onClose} title="Edit the shift" description={`At ${shift.siteName}. Times are on the site's clock.`}>
      {open && <EditForm shift={shift} onSaved={onSaved} onCancel={onClose} />}
    </Dialog>
  );
}
