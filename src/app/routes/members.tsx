import { MembersPage } from '@/features/members/components/members-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/members`: loaded lazily because it brings the table library. */
export function MembersRoute() {
  const { club } = useClubContext();
  return <MembersPage clubId={club.clubId} clubName={club.clubName} />;
}
