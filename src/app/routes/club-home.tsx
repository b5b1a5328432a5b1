import { ClubHome } from '@/features/clubs/components/club-home';
import { MyFees } from '@/features/fees/components/my-fees';
import { MyPlot } from '@/features/plots/components/my-plot';
import { ThisWeekLine } from '@/features/tasks/components/this-week-line';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId`: the club's home page. */
export function ClubHomeRoute() {
  const { user, club } = useClubContext();
  return (
    <>
      <ClubHome club={club} personName={user.name}>
        {club.roles.includes('plot_holder') && (
          <MyPlot clubId={club.clubId} thisWeek={(plotId) => <ThisWeekLine clubId={club.clubId} plotId={plotId} />} />
        )}
      </ClubHome>
      {club.roles.includes('plot_holder') && <MyFees clubId={club.clubId} />}
    </>
  );
}
