import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { InviteCreateBodySchema, roleLabels, roles, type Invite } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox, CheckboxGroup } from '@/components/ui/checkbox';
import { TextField } from '@/components/ui/field';
import { LocalDate } from '@/lib/time-zone';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateInvite } from '../api/create-invite';
import { roleHints } from './role-badges';

/** Name, e-mail and roles; the server e-mails the invite link. */
export function InviteForm({ clubId }: { clubId: number }) {
  const create = useCreateInvite(clubId);
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<Invite | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(InviteCreateBodySchema),
    defaultValues: { name: '', email: '', roles: [] },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setSent(null);
    create.mutate(values, {
      onSuccess: (invite) => {
        setSent(invite);
        reset();
      },
      onError: (error) => setFormError(applyServerErrors(error, setError, ['name', 'email', 'roles'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {sent && (
        <Alert tone="success" title="Invite sent">
          We e-mailed {sent.email} a link to join. It works until <LocalDate value={sent.expiresAt} />.
        </Alert>
      )}
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...register('name')} />
      <TextField
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="off"
        error={errors.email?.message}
        {...register('email')}
      />
      <CheckboxGroup legend="Roles" error={errors.roles?.message}>
        {roles.map((role) => (
          <Checkbox key={role} label={roleLabels[role]} hint={roleHints[role]} value={role} {...register('roles')} />
        ))}
      </CheckboxGroup>
      <Button type="submit" loading={create.isPending} loadingText="Sending…" className="self-start">
        Send invite
      </Button>
    </form>
  );
}
