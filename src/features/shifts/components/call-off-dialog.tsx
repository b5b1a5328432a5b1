import type { Shift } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { isApiError } from '@/lib/api/client';
import { useCallOffShift } from '../api/call-off-shift';
import { shiftWhen } from '../lib/dates';
import { SHIFT_CHANGED_MESSAGE } from './shift-edit-dialog';

export interface CallOffDialogProps {
  open: boolean;
  shift: Shift;
  onClose: () => void;
  onDone: () => void;
}

/** A confirm before calling a shift off, with the version last read (409 when someone changed it). */
export function CallOffDialog({ open, shift, onClose, onDone }: CallOffDialogProps) {
  const callOff = useCallOffShift(shift.id);
  const error = callOff.error;
  return (
    <Dialog open={open} onClose={onClose} title="Call off this shift?" description={`${shift.title}, ${shiftWhen(shift)}.`}>
      <div className="flex flex-col gap-4">
        <p>
          Nobody will be asked to come. {shift.taken > 0 ? `The ${shift.taken === 1 ? 'person' : `${shift.taken} people`} with a place will see it called off on the board and in their shifts.` : 'Nobody has taken a place yet.'}{' '}
          Its tasks stay open for another shift.
        </p>
        {error && <Alert tone="error">{isApiError(error, 409) ? SHIFT_CHANGED_MESSAGE.replace('Your changes are still in the form: check them and save again to keep yours.', 'Check it and call it off again if you still want to.') : error.message}</Alert>}
        <div className="flex flex-wrap gap-3">
          <Button
            variant="danger"
            loading={callOff.isPending}
            loadingText="Calling off…"
            onClick={() => callOff.mutate(shift.version, { onSuccess: onDone })}
          >
            Yes, call it off
          </Button>
          <Button variant="secondary" onClick={onClose} disabled={callOff.isPending}>
            Keep the shift
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
