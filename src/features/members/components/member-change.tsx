import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { MemberUpdateBodySchema, roleLabels, roles, type Member } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox, CheckboxGroup } from '@/components/ui/checkbox';
import { Dialog } from '@/components/ui/dialog';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useUpdateMember } from '../api/update-member';
import { roleHints } from './role-badges';

/**
 * "Change…" on a member row: their roles and whether they pay the concession rate, saved together.
 * A refused change (the club's last coordinator) keeps the dialog open with what was ticked.
 */
export function MemberChange({ clubId, member }: { clubId: number; member: Member }) {
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const update = useUpdateMember(clubId);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(MemberUpdateBodySchema),
    values: { roles: member.roles, concession: member.concession },
  });
  const close = () => {
    setOpen(false);
    setFormError(null);
    reset();
  };
  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    update.mutate(
      { userId: member.userId, body },
      { onSuccess: close, onError: (error) => setFormError(applyServerErrors(error, setError, ['roles', 'concession'])) },
    );
  });
  return (
    <>
      <Button variant="secondary" onClick={() => setOpen(true)} aria-label={`Change… ${member.name}`}>
        Change…
      </Button>
      <Dialog open={open} onClose={close} title={`Change ${member.name}`}>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          {formError && <Alert tone="error">{formError}</Alert>}
          <CheckboxGroup legend="Roles" error={errors.roles?.message ?? errors.roles?.root?.message}>
            {roles.map((role) => (
              <Checkbox key={role} label={roleLabels[role]} hint={roleHints[role]} value={role} {...register('roles')} />
            ))}
          </CheckboxGroup>
          <p className="text-sm text-stone">
            Taking away plot holder releases their pending renewal and frees their plot this season.
          </p>
          <CheckboxGroup legend="Fees" error={errors.concession?.message}>
            <Checkbox
              label="Pays the concession rate"
              hint="The club's concession comes off their plot fees. Fees with nothing paid yet are re-priced; the deposit stays the same."
              {...register('concession')}
            />
          </CheckboxGroup>
          <div className="flex flex-wrap gap-2">
            <Button type="submit" loading={update.isPending} loadingText="Saving…">
              Save changes
            </Button>
            <Button variant="ghost" onClick={close}>
              Cancel
            </Button>
          </div>
        </form>
      </Dialog>
    </>
  );
}
