import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { MailCheck } from 'lucide-react';
import { PasswordResetRequestBodySchema } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { useRequestPasswordReset } from '../api/request-password-reset';

// The same words whatever the address, so the page never tells anyone who has an account.
const NEUTRAL_TEXT = 'If that address has an account, a reset link is on its way. Check your inbox.';

/** Asks for a reset link by e-mail and then shows one neutral confirmation. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(PasswordResetRequestBodySchema), defaultValues: { email: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    request.mutate(values, {
      onError: (error) => setFormError(applyServerErrors(error, setError, ['email'])),
    });
  });

  if (request.isSuccess) {
    return (
      <EmptyState
        icon={MailCheck}
        title="Check your inbox"
        headingLevel="h1"
        action={
          <Link to={paths.signIn()} className="inline-flex min-h-11 items-center underline">
            Back to sign in
          </Link>
        }
      >
        <p>{NEUTRAL_TEXT}</p>
      </EmptyState>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Forgot your password?</h1>
        <p className="mt-1 text-stone">Enter your e-mail and we'll send a link to choose a new one.</p>
      </div>
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <Button type="submit" loading={request.isPending} loadingText="Sending…">
        Send reset link
      </Button>
      <Link to={paths.signIn()} className="inline-flex min-h-11 items-center self-start underline">
        Back to sign in
      </Link>
    </form>
  );
}
