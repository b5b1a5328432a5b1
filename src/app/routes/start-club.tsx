import { useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { storeSession } from '@/features/auth/api/get-session';
import { ConfirmClub } from '@/features/club-signup/components/confirm-club';
import { StartClubForm } from '@/features/club-signup/components/start-club-form';

/** `/start-a-club`: a club's first coordinator signs up; `/start-a-club?token=…` is the e-mailed link. */
export function StartClubRoute() {
  const [params] = useSearchParams();
  const queryClient = useQueryClient();
  const token = params.get('token');
  if (token !== null) {
    return (
      <>
        <title>Start your club · Tillwell</title>
        <ConfirmClub token={token} onSignedIn={(session) => storeSession(queryClient, session)} />
      </>
    );
  }
  return (
    <>
      <title>Start a club · Tillwell</title>
      <StartClubForm />
    </>
  );
}

/** React Router's lazy route takes the module's `Component` export as is. */
export { StartClubRoute as Component };
