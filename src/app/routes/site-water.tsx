import { Link, useParams } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import { SiteGate } from '@/features/sites/components/site-gate';
import { WaterPage } from '@/features/tasks/components/water-page';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/sites/:siteId/water`: a site's water need, rain and deficit, for every member of the club. */
export function SiteWaterRoute() {
  const { club } = useClubContext();
  const { siteId } = useParams();
  const coordinator = club.roles.includes('coordinator');
  return (
    <SiteGate clubId={club.clubId} siteId={Number(siteId)}>
      {(site) => (
        <>
          <Link
            to={coordinator ? paths.sites(club.clubId) : paths.map(club.clubId, site.id)}
            className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium"
          >
            <ArrowLeft className="size-5" aria-hidden="true" />
            {coordinator ? 'All sites' : `Map of ${site.name}`}
          </Link>
          <WaterPage clubId={club.clubId} site={site} isCoordinator={coordinator} />
        </>
      )}
    </SiteGate>
  );
}
