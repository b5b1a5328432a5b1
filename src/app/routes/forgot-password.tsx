import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

/** `/forgot-password`. */
export function ForgotPasswordRoute() {
  return (
    <>
      <title>Forgot password · Tillwell</title>
      <ForgotPasswordForm />
    </>
  );
}
