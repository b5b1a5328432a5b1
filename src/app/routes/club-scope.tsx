import { useEffect } from 'react';
import { Link, Outlet } from 'react-router-dom';
import { SearchX } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { useClubSettings } from '@/features/club-settings/api/get-club-settings';
import { useCurrentClubId } from '@/features/clubs/hooks/use-current-club-id';
import { useRememberClub } from '@/features/auth/api/remember-club';
import { paths } from '@/lib/paths';
import { TimeZoneProvider, useTimeZone } from '@/lib/time-zone';
import { useSignedInContext, type ClubContext } from '../app-context';

/** Layout route for `/clubs/:clubId`: checks the person belongs to the club and remembers it. */
export function ClubScope() {
  const { user } = useSignedInContext();
  const clubId = useCurrentClubId();
  const club = user.clubs.find((membership) => membership.clubId === clubId);
  // Dates on the club's pages are shown in the club's zone once its settings are in.
  const settings = useClubSettings(club?.clubId ?? 0, Boolean(club));
  const zone = useTimeZone();
  const remember = useRememberClub();
  const rememberedId = user.startClubId;
  const { mutate } = remember;

  // The server keeps the club last opened; a failure only means "/" may open another club next time.
  useEffect(() => {
    if (club && club.clubId !== rememberedId) mutate(club.clubId);
  }, [club, rememberedId, mutate]);

  if (!club) {
    return (
      <EmptyState
        icon={SearchX}
        title="This isn't one of your clubs"
        headingLevel="h1"
        action={
          <Link to={paths.home()} className={buttonClasses('primary')}>
            Go to my club
          </Link>
        }
      >
        <p>The link may be old, or you may have left this club. If you should be here, ask its coordinator for an invite.</p>
      </EmptyState>
    );
  }

  const context: ClubContext = { user, club };
  return (
    <TimeZoneProvider zone={settings.data?.timeZone ?? zone}>
      <Outlet context={context} />
    </TimeZoneProvider>
  );
}
