import { Navigate } from 'react-router-dom';
import { Sprout } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { pickStartClub } from '@/features/clubs/lib/last-club';
import { firstName } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useSignedInContext } from '../app-context';

/** "/" for a signed-in person: the last club they used, their first club, or a friendly empty state. */
export function HomeRedirect() {
  const { user } = useSignedInContext();
  const clubId = pickStartClub(user.clubs.map((club) => club.clubId));
  if (clubId !== null) return <Navigate to={paths.club(clubId)} replace />;
  return (
    <Card className="mx-auto max-w-xl">
      <title>Welcome · Tillwell</title>
      <EmptyState icon={Sprout} title={`Welcome, ${firstName(user.name)}`} headingLevel="h1">
        <p>You're not part of a garden club on Tillwell yet.</p>
        <p className="mt-2">
          Ask your club's coordinator to invite you. The link in their e-mail brings you straight into the club.
        </p>
      </EmptyState>
    </Card>
  );
}
