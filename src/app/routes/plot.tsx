import { useParams } from 'react-router-dom';
import { PlotPage } from '@/features/plots/components/plot-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/plots/:plotId`: one plot's page, open to every member of the club. */
export function PlotRoute() {
  const { club } = useClubContext();
  const { plotId } = useParams();
  return <PlotPage clubId={club.clubId} plotId={Number(plotId)} canEdit={club.roles.includes('coordinator')} />;
}
