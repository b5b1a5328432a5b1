import { lazy, Suspense } from 'react';
import { ClubHome } from '@/features/clubs/components/club-home';
import { MyFees } from '@/features/fees/components/my-fees';
import { MyPlot } from '@/features/plots/components/my-plot';
import { ThisWeekLine } from '@/features/tasks/components/this-week-line';
import { useClubContext } from '../app-context';

// Coordinators' pictures and a holder's findings line load in chunks of their own, so a first page
// that does not need them stays light.
// The coordinator's part (first-run checklist and season) is one chunk.
const CoordinatorHome = lazy(() => import('./coordinator-home').then((m) => ({ default: m.CoordinatorHome })));
// A volunteer's week reads the shifts API (checked with zod): its own chunk, so a holder's first page stays light.
const VolunteerWeek = lazy(() => import('@/features/shifts/components/volunteer-week').then((m) => ({ default: m.VolunteerWeek })));
const FindingsLine = lazy(() => import('@/features/plot-book/components/findings-line').then((m) => ({ default: m.FindingsLine })));

/** `/clubs/:clubId`: the club's home page. */
export function ClubHomeRoute() {
  const { user, club } = useClubContext();
  const clubId = club.clubId;
  return (
    <>
      <ClubHome
        club={club}
        personName={user.name}
        sections={{
          coordinator: (
            <Suspense fallback={null}>
              <CoordinatorHome clubId={clubId} />
            </Suspense>
          ),
          volunteer: (
            <Suspense fallback={null}>
              <VolunteerWeek clubId={clubId} />
            </Suspense>
          ),
        }}
      >
        {club.roles.includes('plot_holder') && (
          <MyPlot
            clubId={clubId}
            thisWeek={(plotId) => (
              <>
                <ThisWeekLine clubId={clubId} plotId={plotId} />
                <Suspense fallback={null}>
                  <FindingsLine clubId={clubId} plotId={plotId} />
                </Suspense>
              </>
            )}
          />
        )}
      </ClubHome>
      {club.roles.includes('plot_holder') && <MyFees clubId={clubId} />}
    </>
  );
}
