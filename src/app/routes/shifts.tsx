import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { useSites } from '@/features/sites/api/get-sites';
import { ShiftBoard } from '@/features/shifts/components/shift-board';
import { isApiError } from '@/lib/api/client';
import { useTimeZone } from '@/lib/time-zone';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/shifts?date=&site=&kind=&open=&view=&cal=`: the shift board, for every member of the club. */
export function ShiftsRoute() {
  const { club } = useClubContext();
  const sites = useSites(club.clubId);
  const zone = useTimeZone();
  if (sites.isPending) return <LoadingState label="Loading the shifts…" />;
  if (sites.isError) {
    return (
      <ErrorState
        title="The sites could not be loaded"
        message={sites.error.message}
        requestId={isApiError(sites.error) ? sites.error.requestId : undefined}
        onRetry={() => void sites.refetch()}
        retrying={sites.isFetching}
      />
    );
  }
  const roles = club.roles;
  return (
    <ShiftBoard
      key={club.clubId}
      clubId={club.clubId}
      clubName={club.clubName}
      timeZone={zone}
      sites={sites.data.items.map((s) => ({ id: s.id, name: s.name }))}
      canClaim={roles.includes('volunteer') || roles.includes('coordinator')}
      isCoordinator={roles.includes('coordinator')}
      isVolunteer={roles.includes('volunteer')}
    />
  );
}
