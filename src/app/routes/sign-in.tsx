import { useSearchParams } from 'react-router-dom';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { PASSWORD_CHANGED_NOTICE, PASSWORD_SET_NOTICE } from '@/features/auth/components/reset-password-form';

// Only known notices are shown, so a crafted link cannot put its own words on the page.
const notices: Record<string, string> = {
  [PASSWORD_CHANGED_NOTICE]: 'Your password is changed. Sign in with the new one.',
  [PASSWORD_SET_NOTICE]: 'Your password is set. Sign in with it.',
};

/** `/sign-in`. */
export function SignInRoute() {
  const [params] = useSearchParams();
  const notice = notices[params.get('notice') ?? ''];
  return (
    <>
      <title>Sign in · Tillwell</title>
      <SignInForm notice={notice} />
    </>
  );
}
