import { CoordinatorsOnly } from '@/components/coordinators-only';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { useSites } from '@/features/sites/api/get-sites';
import { PlanPage } from '@/features/shifts/components/plan-page';
import { useTimeZone } from '@/lib/time-zone';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/shifts/plan?from&to&site`: "Build shifts" from the suggestions, for coordinators. */
export function ShiftPlanRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="shift-plan" />;
  return <Plan />;
}

function Plan() {
  const { club } = useClubContext();
  const sites = useSites(club.clubId);
  const zone = useTimeZone();
  if (sites.isPending) return <LoadingState label="Loading the sites…" />;
  if (sites.isError) return <ErrorState headingLevel="h1" title="The sites could not be loaded" message={sites.error.message} onRetry={() => void sites.refetch()} retrying={sites.isFetching} />;
  return (
    <PlanPage
      key={club.clubId}
      clubId={club.clubId}
      clubName={club.clubName}
      timeZone={zone}
      sites={sites.data.items.map((s) => ({ id: s.id, name: s.name, units: s.units }))}
    />
  );
}
