import { lazy, Suspense } from 'react';
import { ClubHome } from '@/features/clubs/components/club-home';
import { MyFees } from '@/features/fees/components/my-fees';
import { MyPlot } from '@/features/plots/components/my-plot';
import { ThisWeekLine } from '@/features/tasks/components/this-week-line';
import { useClubContext } from '../app-context';

// Coordinators' pictures and a holder's findings line load in chunks of their own, so a first page
// that does not need them stays light.
const SeasonGlance = lazy(() => import('@/features/season-summary/components/season-glance').then((m) => ({ default: m.SeasonGlance })));
// A volunteer's week reads the shifts API (checked with zod): its own chunk, so a holder's first page stays light.
const VolunteerWeek = lazy(() => import('@/features/shifts/components/volunteer-week').then((m) => ({ default: m.VolunteerWeek })));
// The first-run checklist is a coordinator's only, in a chunk of its own (the holder's first page is near its budget).
const FirstRunChecklist = lazy(() => import('@/features/clubs/components/first-run-checklist').then((m) => ({ default: m.FirstRunChecklist })));
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
              <FirstRunChecklist clubId={clubId} />
              <SeasonGlance clubId={clubId} />
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
