import { useState } from 'react';
import { Check, HandHelping, Undo2 } from 'lucide-react';
import type { Shift } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { useClaimShift } from '../api/claim-shift';
import { useMarkShiftDone } from '../api/mark-shift-done';
import { useReleaseShift } from '../api/release-shift';
import { shiftActions } from '../lib/actions';
import { shiftWhen } from '../lib/dates';
import { CautionNote } from './caution-note';
import { DoneForm } from './done-form';

export interface ShiftActionsProps {
  shift: Shift;
  /** Volunteers and coordinators may take places; plot holders only look. */
  canClaim: boolean;
  /** A smaller caution box, for cards on the board. */
  compact?: boolean;
  /** False where the page shows the caution right above these buttons already. */
  withCaution?: boolean;
}

/**
 * The buttons for one shift: take a place, give it back (after a confirm), or say it is done (in a
 * dialog with a note, hours and a photo). The caution stays beside them; each answer is said where the
 * buttons are, and a refused request (every place taken, say) shows the server's words.
 */
export function ShiftActions({ shift, canClaim, compact = false, withCaution = true }: ShiftActionsProps) {
  const claim = useClaimShift();
  const release = useReleaseShift();
  const done = useMarkShiftDone(shift.id);
  const [confirmRelease, setConfirmRelease] = useState(false);
  const [doneOpen, setDoneOpen] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const can = shiftActions(shift, { canClaim });
  const busy = claim.isPending || release.isPending;
  const mine = shift.myClaim?.status === 'taken';

  const onClaim = () => {
    setNotice(null);
    setError(null);
    claim.mutate(shift.id, {
      onSuccess: () => setNotice(`You have a place: ${shiftWhen(shift)}. It is on My shifts too.`),
      onError: (e) => setError(e.message),
    });
  };
  const onRelease = () => {
    setNotice(null);
    setError(null);
    release.mutate(shift.id, {
      onSuccess: () => {
        setConfirmRelease(false);
        setNotice('Your place is given back. Thank you for saying so in time.');
      },
      onError: (e) => setError(e.message),
    });
  };

  const hasButtons = can.claim || can.release || can.done;
  return (
    <div className="flex flex-col gap-3">
      {withCaution && (hasButtons || mine) && <CautionNote caution={shift.caution} compact={compact} />}
      {notice && (
        <Alert tone="success" announce>
          {notice}
        </Alert>
      )}
      {error && <Alert tone="error">{error}</Alert>}
      {mine && !notice && <p className="font-medium text-leaf-800">You have a place on this shift.</p>}
      {shift.myClaim?.status === 'done' && <p className="font-medium text-leaf-800">You marked this shift done. Thank you!</p>}
      {can.note && <p className="text-stone">{can.note}</p>}
      {confirmRelease ? (
        <div className="flex flex-wrap items-center gap-3" role="group" aria-label="Confirm giving the place back">
          <span className="font-medium">Give back your place on “{shift.title}”?</span>
          <Button variant="danger" loading={release.isPending} loadingText="Giving back…" onClick={onRelease}>
            Yes, give it back
          </Button>
          <Button variant="secondary" onClick={() => setConfirmRelease(false)} disabled={release.isPending}>
            Keep my place
          </Button>
        </div>
      ) : (
        hasButtons && (
          <div className="flex flex-wrap gap-3">
            {can.claim && (
              <Button className="min-h-12 px-6 text-lg" loading={claim.isPending} loadingText="Taking a place…" disabled={busy} onClick={onClaim} aria-label={`Take a place on ${shift.title}`}>
                <HandHelping className="size-5" aria-hidden="true" />
                Take a place
              </Button>
            )}
            {can.done && (
              <Button className="min-h-12 px-6 text-lg" disabled={busy} onClick={() => setDoneOpen(true)} aria-label={`Mark done: ${shift.title}`}>
                <Check className="size-5" aria-hidden="true" />
                Mark done
              </Button>
            )}
            {can.release && (
              <Button variant="secondary" disabled={busy} onClick={() => setConfirmRelease(true)} aria-label={`Give back my place on ${shift.title}`}>
                <Undo2 className="size-5" aria-hidden="true" />
                Give back my place
              </Button>
            )}
          </div>
        )
      )}
      <Dialog open={doneOpen} onClose={() => setDoneOpen(false)} title="How did it go?" description={`${shift.title}, ${shiftWhen(shift)}.`}>
        <DoneForm
          estHours={shift.estHours}
          onCancel={() => setDoneOpen(false)}
          onSubmit={async (body, photo) => {
            await done.mutateAsync({ body, photo });
            setDoneOpen(false);
            setNotice('Marked done. Thank you! Your hours are counted.');
          }}
        />
      </Dialog>
    </div>
  );
}
