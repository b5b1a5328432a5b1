import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { SignInBodySchema } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { useSignIn } from '../api/sign-in';

/** E-mail and password form; on success the stored session moves the person on. */
export function SignInForm({ notice }: { notice?: string }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(SignInBodySchema), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    signIn.mutate(values, {
      onError: (error) => setFormError(applyServerErrors(error, setError, ['email', 'password'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Sign in</h1>
        <p className="mt-1 text-stone">Welcome back to the garden.</p>
      </div>
      {notice && <Alert tone="success">{notice}</Alert>}
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <div className="flex flex-col gap-2">
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...register('password')}
        />
        <Link to={paths.forgotPassword()} className="inline-flex min-h-11 items-center self-start underline">
          Forgot your password?
        </Link>
      </div>
      <Button type="submit" loading={signIn.isPending} loadingText="Signing in…">
        Sign in
      </Button>
      <p className="text-sm">
        New to Tillwell and running a garden club?{' '}
        <Link to={'/start-a-club'} className="inline-flex min-h-11 items-center underline">
          Start a club
        </Link>
      </p>
    </form>
  );
}
