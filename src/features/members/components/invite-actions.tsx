import { useState } from 'react';
import type { Invite } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { LocalDate } from '@/lib/time-zone';
import { useCancelInvite } from '../api/cancel-invite';
import { useResendInvite } from '../api/resend-invite';

/**
 * A pending or expired invite's actions: send it again (a new link, 14 more days; the old link
 * stops working) or cancel it, with a confirm: the link then says it is no longer valid.
 */
export function InviteActions({ clubId, invite }: { clubId: number; invite: Invite }) {
  const [open, setOpen] = useState(false);
  const cancel = useCancelInvite(clubId);
  const resend = useResendInvite(clubId);
  const close = () => {
    setOpen(false);
    cancel.reset();
  };
  return (
    <div className="flex flex-col items-start gap-1">
      <div className="flex flex-wrap gap-2">
        <Button
          variant="secondary"
          onClick={() => resend.mutate(invite.id)}
          loading={resend.isPending}
          loadingText="Sending…"
          aria-label={`Send again ${invite.email}`}
        >
          Send again
        </Button>
        <Button variant="secondary" onClick={() => setOpen(true)} aria-label={`Cancel invite ${invite.email}`}>
          Cancel invite
        </Button>
      </div>
      <p role="status" className="text-sm">
        {resend.isSuccess && (
          <span className="text-leaf-800">
            Sent again; the new link works until <LocalDate value={resend.data.expiresAt} />.
          </span>
        )}
        {resend.isError && <span className="text-clay-700">{resend.error.message}</span>}
      </p>
      <Dialog open={open} onClose={close} title={`Cancel the invite to ${invite.email}?`} description="The link in their e-mail will say it is no longer valid. You can invite them again later.">
        {cancel.isError && <Alert tone="error">{cancel.error.message}</Alert>}
        <div className="flex flex-col gap-2">
          <Button variant="danger" onClick={() => cancel.mutate(invite.id, { onSuccess: close })} loading={cancel.isPending} loadingText="Cancelling…">
            Cancel the invite
          </Button>
          <Button variant="ghost" onClick={close}>
            Keep it
          </Button>
        </div>
      </Dialog>
    </div>
  );
}
