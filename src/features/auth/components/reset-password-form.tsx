import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { PasswordResetBodySchema } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { LoadingState } from '@/components/ui/spinner';
import { usePasswordResetCheck } from '../api/check-password-reset';
import { useResetPassword } from '../api/reset-password';
import { LinkProblem } from './link-problem';

// The body schema's password rule plus a second entry, checked here because the server never sees it.
const ResetPasswordFormSchema = z
  .object({
    password: PasswordResetBodySchema.shape.password,
    confirmPassword: z.string().min(1, 'Type the new password again'),
  })
  .refine((values) => values.password === values.confirmPassword, {
    path: ['confirmPassword'],
    message: "The two passwords don't match",
  });

type LinkState = 'ok' | 'invalid' | 'expired';

/** Query-string value for the sign-in page's "password changed" notice. */
export const PASSWORD_CHANGED_NOTICE = 'password-changed';
/** Query-string value for the sign-in page's "password set" notice, after a first password. */
export const PASSWORD_SET_NOTICE = 'password-set';

/** New password twice; a used, expired or broken link turns into a designed dead end. */
export function ResetPasswordForm({ token }: { token: string | null }) {
  const navigate = useNavigate();
  const reset = useResetPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const wellFormed = PasswordResetBodySchema.shape.token.safeParse(token).success;
  const [linkState, setLinkState] = useState<LinkState>(wellFormed ? 'ok' : 'invalid');
  // The link is checked (not used) on opening, so a dead one says so before anyone types a password.
  const check = usePasswordResetCheck(token ?? '', wellFormed);
  const first = check.data?.firstPassword ?? false;
  const shownState: LinkState =
    linkState !== 'ok' ? linkState : isApiError(check.error, 410) ? 'expired' : isApiError(check.error, 404) || isApiError(check.error, 400) ? 'invalid' : 'ok';
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ResetPasswordFormSchema),
    defaultValues: { password: '', confirmPassword: '' },
  });

  const onSubmit = handleSubmit(({ password }) => {
    if (!token) return;
    setFormError(null);
    reset.mutate(
      { token, password },
      {
        onSuccess: () => navigate(`${paths.signIn()}?notice=${first ? PASSWORD_SET_NOTICE : PASSWORD_CHANGED_NOTICE}`, { replace: true }),
        onError: (error) => {
          if (isApiError(error, 410)) setLinkState('expired');
          else if (isApiError(error, 400) && error.fields?.token) setLinkState('invalid');
          else setFormError(applyServerErrors(error, setError, ['password']));
        },
      },
    );
  });

  if (shownState === 'expired') {
    return (
      <LinkProblem title="This reset link has run out" actionLabel="Send a new link" actionHref={paths.forgotPassword()}>
        <p>It was already used or it has expired. Ask for a new one; it only takes a moment.</p>
      </LinkProblem>
    );
  }
  if (shownState === 'invalid') {
    return (
      <LinkProblem title="This reset link doesn't work" actionLabel="Send a new link" actionHref={paths.forgotPassword()}>
        <p>The link may have been cut short when it was copied. Ask for a new one and open it straight from the e-mail.</p>
      </LinkProblem>
    );
  }

  if (check.isPending) return <LoadingState label="Checking your link…" />;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">{first ? 'Choose your password' : 'Choose a new password'}</h1>
        <p className="mt-1 text-stone">You'll use it the next time you sign in.</p>
      </div>
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label={first ? 'Password' : 'New password'}
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label={first ? 'Password again' : 'New password again'}
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...register('confirmPassword')}
      />
      <Button type="submit" loading={reset.isPending} loadingText="Saving…">
        {first ? 'Save my password' : 'Save new password'}
      </Button>
    </form>
  );
}
