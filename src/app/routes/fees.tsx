import { useClubSettings } from '@/features/club-settings/api/get-club-settings';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { FeesPage } from '@/features/fees/components/fees-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/fees`: coordinators' fees and payments, shown in the club currency. */
export function FeesRoute() {
  const { club } = useClubContext();
  const settings = useClubSettings(club.clubId);
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="fees" />;
  return <FeesPage clubId={club.clubId} clubName={club.clubName} currency={settings.data?.currency ?? 'GBP'} />;
}
