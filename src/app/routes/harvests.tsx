import { HarvestsPage } from '@/features/harvests/components/harvests-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/harvests`: the club's harvest figures per crop, open to every member. */
export function HarvestsRoute() {
  const { club } = useClubContext();
  return <HarvestsPage clubId={club.clubId} clubName={club.clubName} />;
}
