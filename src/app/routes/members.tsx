import { MembersPage } from '@/features/members/components/members-page';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/members`: loaded lazily because it brings the table library; coordinators only. */
export function MembersRoute() {
  const { club } = useClubContext();
  // Decided here from the membership, so nobody else sees the invite form while a 403 is on its way.
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="members" />;
  return <MembersPage clubId={club.clubId} clubName={club.clubName} />;
}
