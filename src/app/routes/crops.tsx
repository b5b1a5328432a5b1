import { CropsPage } from '@/features/crops/components/crops-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/crops`: the crop notes table, open to every member of the club; coordinators may add club crops. */
export function CropsRoute() {
  const { club } = useClubContext();
  return <CropsPage clubId={club.clubId} clubName={club.clubName} canAddCrops={club.roles.includes('coordinator')} />;
}
