import { MessagesPage } from '@/features/mailings/components/messages-page';
import { useSites } from '@/features/sites/api/get-sites';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/messages`: coordinators write to the club; the sites feed the audience choice. */
export function MessagesRoute() {
  const { club } = useClubContext();
  const sites = useSites(club.clubId);
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="people" />;
  return <MessagesPage clubId={club.clubId} clubName={club.clubName} sites={sites.data?.items ?? []} />;
}
