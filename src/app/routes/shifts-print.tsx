import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { ShiftRota } from '@/features/shifts/components/shift-rota';
import { useSites } from '@/features/sites/api/get-sites';
import { isApiError } from '@/lib/api/client';
import { useTimeZone } from '@/lib/time-zone';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/shifts/print?date=&site=&kind=&open=`: the week's shift rota to print, for every member. */
export function ShiftsPrintRoute() {
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
  return (
    <ShiftRota
      key={club.clubId}
      clubId={club.clubId}
      clubName={club.clubName}
      timeZone={zone}
      sites={sites.data.items.map((s) => ({ id: s.id, name: s.name }))}
      isCoordinator={club.roles.includes('coordinator')}
    />
  );
}
