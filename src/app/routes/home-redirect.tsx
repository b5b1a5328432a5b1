import { Navigate } from 'react-router-dom';
import { Sprout } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { firstName } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useSignedInContext } from '../app-context';

/** "/" for a signed-in person: the club the server picked (last used, else most to do), or a friendly empty state. */
export function HomeRedirect() {
  const { user } = useSignedInContext();
  const clubId = user.startClubId;
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
