import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Send } from 'lucide-react';
import { AskForHelpBodySchema, type Shift } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField } from '@/components/ui/field';
import { useIdempotencyKeys } from '@/lib/api/idempotency';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useAskForHelp, type AskForHelpBody, type AskForHelpResult } from '../api/ask-for-help';
import { placesLeftText } from '../lib/words';

/** What came of asking: how many e-mails went, and how many volunteers were left out. */
export function askResultText(r: AskForHelpResult): string {
  const sent = r.sent === 0 ? 'No e-mail was sent' : r.sent === 1 ? 'Sent to 1 volunteer' : `Sent to ${r.sent} volunteers`;
  const skipped = r.skipped === 0 ? '' : ` ${r.skipped === 1 ? '1 volunteer was' : `${r.skipped} volunteers were`} left out: they turned calls for help off.`;
  return `${sent}.${skipped}`;
}

function AskForm({ shift, onSent, onCancel }: { shift: Shift; onSent: (r: AskForHelpResult) => void; onCancel: () => void }) {
  const ask = useAskForHelp(shift.id);
  const keys = useIdempotencyKeys();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<AskForHelpBody, unknown, { note: string }>({ resolver: zodResolver(AskForHelpBodySchema), defaultValues: { note: '' } });

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    // The same note sent again after a failure reuses its key, so nobody gets the e-mail twice.
    ask.mutate(
      { body, idempotencyKey: keys.keyFor(body) },
      {
        onSuccess: (result) => {
          keys.succeeded(body);
          onSent(result);
        },
        onError: (error) => setFormError(applyServerErrors(error, setError, ['note'])),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {formError && <Alert tone="error">{formError}</Alert>}
      <p>
        Each volunteer who gets help e-mails is sent the shift ({placesLeftText(shift.taken, shift.capacity).toLowerCase()}) with a link to take a place, no sign-in
        needed.
      </p>
      <TextAreaField label="A note from you (optional)" hint="Put at the top of the e-mail, e.g. why this one matters." rows={3} maxLength={1000} error={errors.note?.message} {...register('note')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={ask.isPending} loadingText="Sending…">
          <Send className="size-5" aria-hidden="true" />
          Send the e-mails
        </Button>
        <Button variant="ghost" onClick={onCancel} disabled={ask.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export interface AskHelpDialogProps {
  open: boolean;
  shift: Shift;
  onClose: () => void;
  onSent: (result: AskForHelpResult) => void;
}

/** "Ask for help by e-mail": an optional note, then the count of e-mails sent. */
export function AskHelpDialog({ open, shift, onClose, onSent }: AskHelpDialogProps) {
  return (
    <Dialog open={open} onClose={onClose} title="Ask for help by e-mail" description={shift.title}>
      {open && <AskForm shift={shift} onSent={onSent} onCancel={onClose} />}
    </Dialog>
  );
}
