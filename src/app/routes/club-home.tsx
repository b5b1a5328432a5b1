import { ClubHome } from '@/features/clubs/components/club-home';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId`: the club's home page. */
export function ClubHomeRoute() {
  const { user, club } = useClubContext();
  return <ClubHome club={club} personName={user.name} />;
}
