import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { ShiftDetail } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { useIdempotencyKeys } from '@/lib/api/idempotency';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateShift } from '../api/create-shift';
import { ShiftFormSchema, shiftFormFieldNames, type ShiftFormValues } from '../lib/shift-form';
import { ShiftFields } from './shift-fields';
import type { z } from 'zod';

type Checked = z.output<typeof ShiftFormSchema>;

function OwnShiftForm({ clubId, sites, date, onCreated, onCancel }: OwnShiftDialogProps & { date: string }) {
  const create = useCreateShift(clubId);
  const keys = useIdempotencyKeys();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ShiftFormValues, unknown, Checked>({
    resolver: zodResolver(ShiftFormSchema),
    // A morning work day for a few people is the usual own shift; every value can be changed.
    defaultValues: {
      siteId: sites.length === 1 ? String(sites[0].id) : '',
      title: 'Work day',
      kind: 'mixed',
      date,
      startTime: '10:00',
      endTime: '12:00',
      capacity: '4',
      estHours: '2',
      instructions: '',
    },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    const body = { ...values, taskIds: [] };
    create.mutate(
      { body, idempotencyKey: keys.keyFor(body) },
      {
        onSuccess: (shift) => {
          keys.succeeded(body);
          onCreated(shift);
        },
        onError: (error) => setFormError(applyServerErrors(error, setError, shiftFormFieldNames)),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <ShiftFields register={register} errors={errors} show={{ site: sites, kind: true, date: true }} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={create.isPending} loadingText="Creating…">
          Create the shift
        </Button>
        <Button variant="ghost" onClick={onCancel} disabled={create.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export interface OwnShiftDialogProps {
  open?: boolean;
  clubId: number;
  sites: Array<{ id: number; name: string }>;
  /** The first date offered (the start of the range on screen). */
  date?: string;
  onCreated: (shift: ShiftDetail) => void;
  onCancel: () => void;
}

/** "Add a shift of your own": a work day with no tasks, any site, date and time. */
export function OwnShiftDialog({ open = false, date = '', ...props }: OwnShiftDialogProps) {
  return (
    <Dialog open={open} onClose={props.onCancel} title="Add a shift of your own" description="A work day or any job that is not one of the open tasks. Times are on the site's clock.">
      {open && <OwnShiftForm {...props} date={date} />}
    </Dialog>
  );
}
