import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { InviteAcceptBodySchema, roleWords, type InvitePreview } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { TextField } from '@/components/ui/field';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { useAcceptInvite } from '../api/accept-invite';
import { useInvitePreview } from '../api/get-invite-preview';
import { LinkProblem } from './link-problem';

const InviteAcceptFormSchema = InviteAcceptBodySchema.omit({ token: true });

function BrokenInvite() {
  return (
    <LinkProblem title="This invite link doesn't work" actionLabel="Go to sign in" actionHref={paths.signIn()}>
      <p>It may have been cut short when it was copied. Ask your club's coordinator to send the invite again.</p>
    </LinkProblem>
  );
}

/** An invite link that worked once: expired, used, cancelled or replaced; the server's message says which. */
function SpentInvite({ reason }: { reason?: string }) {
  return (
    <LinkProblem title="This invite link no longer works" actionLabel="Go to sign in" actionHref={paths.signIn()}>
      {reason && <p>{reason}</p>}
      <p>If you already joined, just sign in. Otherwise ask your club's coordinator for a fresh invite.</p>
    </LinkProblem>
  );
}

function AcceptForm({ token, preview, onSpent }: { token: string; preview: InvitePreview; onSpent: () => void }) {
  const navigate = useNavigate();
  const accept = useAcceptInvite();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(InviteAcceptFormSchema),
    defaultValues: { name: preview.name, password: '' },
  });
  const roleText = roleWords(preview.roles);

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    accept.mutate(
      { token, ...values },
      {
        onSuccess: () => navigate(paths.home(), { replace: true }),
        onError: (error) => {
          if (isApiError(error, 410) || isApiError(error, 404)) onSpent();
          else setFormError(applyServerErrors(error, setError, ['name', 'password']));
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Join {preview.clubName}</h1>
        <p className="mt-2">
          You're invited to <strong className="font-semibold">{preview.clubName}</strong> as {roleText}.
        </p>
        <p className="mt-1 text-sm text-stone">This invite is for {preview.email}.</p>
      </div>
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField
        label={preview.hasAccount ? 'Your Tillwell password' : 'Choose a password'}
        type="password"
        autoComplete={preview.hasAccount ? 'current-password' : 'new-password'}
        hint={
          preview.hasAccount
            ? 'You already have an account with this e-mail. Enter its password to add this club.'
            : 'At least 10 characters.'
        }
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" loading={accept.isPending} loadingText="Joining…">
        Join {preview.clubName}
      </Button>
    </form>
  );
}

function InvitePreviewGate({ token }: { token: string }) {
  const preview = useInvitePreview(token);
  const [spent, setSpent] = useState(false);

  if (spent) return <SpentInvite />;
  if (preview.isPending) return <LoadingState label="Opening your invite…" />;
  if (preview.isError) {
    if (isApiError(preview.error, 404)) return <BrokenInvite />;
    if (isApiError(preview.error, 410)) return <SpentInvite reason={preview.error.message} />;
    return (
      <ErrorState
        headingLevel="h1"
        title="We couldn't open this invite"
        message={preview.error.message}
        onRetry={() => void preview.refetch()}
        retrying={preview.isFetching}
      />
    );
  }
  return <AcceptForm token={token} preview={preview.data} onSpent={() => setSpent(true)} />;
}

/** The invite page: preview of club and roles, then name and password to join. */
export function InviteAccept({ token }: { token: string | null }) {
  if (!token || !InviteAcceptBodySchema.shape.token.safeParse(token).success) return <BrokenInvite />;
  return <InvitePreviewGate token={token} />;
}
