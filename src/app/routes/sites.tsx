import { CoordinatorsOnly } from '@/components/coordinators-only';
import { SitesPage } from '@/features/sites/components/sites-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/sites`: coordinators' list of sites and the form to add one. */
export function SitesRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="sites" />;
  return <SitesPage clubId={club.clubId} clubName={club.clubName} />;
}
