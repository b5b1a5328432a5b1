import { useParams } from 'react-router-dom';
import { CropPage } from '@/features/crops/components/crop-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/crops/:cropId`: one crop's notes, open to every member of the club; coordinators may set club values. */
export function CropRoute() {
  const { club } = useClubContext();
  const { cropId } = useParams();
  return <CropPage clubId={club.clubId} cropId={Number(cropId)} canSetClubValues={club.roles.includes('coordinator')} />;
}
