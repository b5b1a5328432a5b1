import { Navigate } from 'react-router-dom';
import { Shovel } from 'lucide-react';
import { DeadEnd } from '@/components/ui/dead-end';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { useMyPlot } from '@/features/plots/api/get-my-plot';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/my-plot`: straight to the holder's own plot book, or says there is none yet. */
export function MyPlotRoute() {
  const { club } = useClubContext();
  const mine = useMyPlot(club.clubId);
  if (mine.isPending) return <LoadingState label="Finding your plot…" />;
  if (mine.isError) return <ErrorState headingLevel="h1" message={mine.error.message} onRetry={() => void mine.refetch()} retrying={mine.isFetching} />;
  if (!mine.data.holding) {
    return (
      <DeadEnd clubId={club.clubId} icon={Shovel} title="No plot yet">
        <p>When the coordinator gives you a plot, its plot book opens here.</p>
      </DeadEnd>
    );
  }
  return <Navigate to={paths.plotBook(club.clubId, mine.data.holding.plotId)} replace />;
}
