import { useSites } from '@/features/sites/api/get-sites';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { WaitlistPage } from '@/features/waitlist/components/waitlist-page';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/waitlist`: the coordinator's queue; the sites feed its site filter. */
export function WaitlistRoute() {
  const { club } = useClubContext();
  const coordinator = club.roles.includes('coordinator');
  const sites = useSites(club.clubId);
  if (!coordinator) return <CoordinatorsOnly clubId={club.clubId} page="people" />;
  return (
    <WaitlistPage
      clubId={club.clubId}
      clubName={club.clubName}
      applyUrl={`${window.location.origin}${paths.apply(club.clubSlug)}`}
      sites={sites.data?.items ?? []}
    />
  );
}
