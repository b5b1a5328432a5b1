import { useSearchParams } from 'react-router-dom';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';

/** `/reset-password?token=…`. */
export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>New password · Tillwell</title>
      <ResetPasswordForm token={params.get('token')} />
    </>
  );
}
