import { useState } from 'react';
import { roleLabels, type Member } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { useRemoveMember } from '../api/remove-member';

/**
 * "Remove…" on a member row: a dialog to take away one role or remove them from the club. Nothing
 * happens until a choice inside the dialog is pressed; the server keeps the club's last coordinator.
 */
export function MemberActions({ clubId, member }: { clubId: number; member: Member }) {
  const [open, setOpen] = useState(false);
  const remove = useRemoveMember(clubId);
  const close = () => {
    setOpen(false);
    remove.reset();
  };
  const run = (role?: Member['roles'][number]) => remove.mutate({ userId: member.userId, role }, { onSuccess: close });
  return (
    <>
      <Button variant="secondary" onClick={() => setOpen(true)} aria-label={`Remove… ${member.name}`}>
        Remove…
      </Button>
      <Dialog
        open={open}
        onClose={close}
        title={`Remove ${member.name}?`}
        description="Taking away plot holder also releases their pending renewal and frees their plot this season. Their fees stay on record."
      >
        {remove.isError && <Alert tone="error">{remove.error.message}</Alert>}
        <div className="flex flex-col gap-2">
          {member.roles.length > 1 &&
            member.roles.map((role) => (
              <Button key={role} variant="secondary" onClick={() => run(role)} disabled={remove.isPending}>
                Take away {roleLabels[role]}
              </Button>
            ))}
          <Button variant="danger" onClick={() => run()} loading={remove.isPending} loadingText="Removing…">
            Remove from the club
          </Button>
          <Button variant="ghost" onClick={close}>
            Keep {member.name}
          </Button>
        </div>
      </Dialog>
    </>
  );
}
