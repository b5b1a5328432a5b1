import { useParams, useSearchParams } from 'react-router-dom';
import { PlotBookPage } from '@/features/plot-book/components/plot-book-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/plots/:plotId/book?year=`: a plot's plot book; the server decides who may read or write it. */
export function PlotBookRoute() {
  const { club } = useClubContext();
  const { plotId } = useParams();
  const [search] = useSearchParams();
  const year = Number(search.get('year'));
  return (
    <PlotBookPage
      key={`${plotId}-${year}`}
      clubId={club.clubId}
      plotId={Number(plotId)}
      year={Number.isInteger(year) && year >= 2000 && year <= 2100 ? year : undefined}
      isCoordinator={club.roles.includes('coordinator')}
    />
  );
}
