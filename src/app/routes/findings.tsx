import { CoordinatorsOnly } from '@/components/coordinators-only';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { FindingsPage } from '@/features/findings/components/findings-table';
import { useSites } from '@/features/sites/api/get-sites';
import { useSeasons } from '@/features/spring-round/api/get-seasons';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/findings?season=&site=&severity=&kind=`: the club's neighbour check as a table, for coordinators. */
export function FindingsRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="findings" />;
  return <Findings />;
}

function Findings() {
  const { club } = useClubContext();
  const seasons = useSeasons(club.clubId);
  const sites = useSites(club.clubId);
  if (seasons.isPending || sites.isPending) return <LoadingState label="Loading the neighbour check…" />;
  if (seasons.isError) return <ErrorState headingLevel="h1" title="The seasons could not be loaded" message={seasons.error.message} onRetry={() => void seasons.refetch()} />;
  if (sites.isError) return <ErrorState headingLevel="h1" title="The sites could not be loaded" message={sites.error.message} onRetry={() => void sites.refetch()} />;
  return (
    <FindingsPage
      clubId={club.clubId}
      clubName={club.clubName}
      seasons={seasons.data.items.map((s) => ({ id: s.id, year: s.year }))}
      sites={sites.data.items.map((s) => ({ id: s.id, name: s.name }))}
    />
  );
}
