import { useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { storeSession } from '@/features/auth/api/get-session';
import { ConfirmClub } from '@/features/club-signup/components/confirm-club';
import { StartClubForm } from '@/features/club-signup/components/start-club-form';

/** `/start-a-club`: a club's first coordinator signs up. */
export function StartClubRoute() {
  return (
    <>
      <title>Start a club · Tillwell</title>
      <StartClubForm />
    </>
  );
}

/** `/start-a-club/confirm?token=…`: the e-mailed link. */
export function ConfirmClubRoute() {
  const [params] = useSearchParams();
  const queryClient = useQueryClient();
  return (
    <>
      <title>Start your club · Tillwell</title>
      <ConfirmClub token={params.get('token')} onSignedIn={(session) => storeSession(queryClient, session)} />
    </>
  );
}
