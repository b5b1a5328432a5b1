import { useParams } from 'react-router-dom';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { SiteEditPage } from '@/features/sites/components/site-edit-page';
import { SiteGate } from '@/features/sites/components/site-gate';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/sites/:siteId/edit`: a site's details and map background, for coordinators. */
export function SiteEditRoute() {
  const { club } = useClubContext();
  const { siteId } = useParams();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="sites" />;
  return (
    <SiteGate clubId={club.clubId} siteId={Number(siteId)}>
      {(site) => <SiteEditPage clubId={club.clubId} clubName={club.clubName} site={site} />}
    </SiteGate>
  );
}
