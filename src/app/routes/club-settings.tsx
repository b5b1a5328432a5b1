import { useQueryClient } from '@tanstack/react-query';
import { sessionQueryOptions } from '@/features/auth/api/get-session';
import { ClubSettingsPage } from '@/features/club-settings/components/club-settings-page';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { FeeScheduleSection } from '@/features/fees/components/fee-schedule-section';
import { ChecklistSetting } from '@/features/clubs/components/first-run-checklist';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/settings`: the club's rules, then its fee schedule in the club currency. */
export function ClubSettingsRoute() {
  const { club } = useClubContext();
  const queryClient = useQueryClient();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="settings" />;
  return (
    <ClubSettingsPage
      clubId={club.clubId}
      clubName={club.clubName}
      // The club's name shows in the header and switcher, which read it from the session.
      onSaved={() => void queryClient.invalidateQueries({ queryKey: sessionQueryOptions().queryKey })}
    >
      {(settings) => (
        <>
          <FeeScheduleSection clubId={club.clubId} currency={settings.currency} />
          <ChecklistSetting clubId={club.clubId} />
        </>
      )}
    </ClubSettingsPage>
  );
}
