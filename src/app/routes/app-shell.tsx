import { Navigate, Outlet } from 'react-router-dom';
import type { SessionUser } from '@shared/schemas/auth';
import { AppLayout } from '@/components/layouts/app-layout';
import { Alert } from '@/components/ui/alert';
import { useSignOut } from '@/features/auth/api/sign-out';
import { ClubSwitcher } from '@/features/clubs/components/club-switcher';
import { useCurrentClubId } from '@/features/clubs/hooks/use-current-club-id';
import { paths } from '@/lib/paths';
import type { SignedInContext } from '../app-context';
import { navItemsFor } from '../navigation';
import { SessionGate } from './session-gate';

function SignedInFrame({ user }: { user: SessionUser }) {
  const signOut = useSignOut();
  const clubId = useCurrentClubId();
  const club = user.clubs.find((membership) => membership.clubId === clubId);
  const context: SignedInContext = { user };

  return (
    <AppLayout
      homeHref={club ? paths.club(club.clubId) : paths.home()}
      nav={club ? navItemsFor(club) : []}
      clubPicker={<ClubSwitcher clubs={user.clubs} currentClubId={club?.clubId ?? null} />}
      personName={user.name}
      accountLink={club ? { to: paths.emailChoices(club.clubId), label: 'E-mail choices' } : undefined}
      onSignOut={() => signOut.mutate()}
      signingOut={signOut.isPending}
    >
      {signOut.isError && (
        <Alert tone="error" className="mb-6">
          Signing out didn't work: {signOut.error.message}
        </Alert>
      )}
      <Outlet context={context} />
    </AppLayout>
  );
}

/** Layout route for signed-in pages: guards the session and draws the app frame. */
export function AppShell() {
  return (
    <SessionGate>
      {({ user }) => (user ? <SignedInFrame user={user} /> : <Navigate to={paths.signIn()} replace />)}
    </SessionGate>
  );
}
