import { MyShiftsPage } from '@/features/shifts/components/my-shifts-page';
import { useTimeZone } from '@/lib/time-zone';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/my-shifts`: a volunteer's own shifts, hours, shift e-mail choices and calendar address. */
export function MyShiftsRoute() {
  const { club } = useClubContext();
  const zone = useTimeZone();
  return <MyShiftsPage key={club.clubId} clubId={club.clubId} clubName={club.clubName} timeZone={zone} />;
}
