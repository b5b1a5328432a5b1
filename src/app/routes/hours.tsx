import { CoordinatorsOnly } from '@/components/coordinators-only';
import { HoursPage } from '@/features/shifts/components/hours-page';
import { useTimeZone } from '@/lib/time-zone';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/hours?year=`: every volunteer's hours in a season, for coordinators. */
export function HoursRoute() {
  const { club } = useClubContext();
  const zone = useTimeZone();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="hours" />;
  return <HoursPage key={club.clubId} clubId={club.clubId} clubName={club.clubName} timeZone={zone} />;
}
