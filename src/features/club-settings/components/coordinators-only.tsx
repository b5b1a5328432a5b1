import { NotAllowed } from '@/components/ui/not-allowed';

/** Shown instead of the settings page to someone who is not a coordinator of the club. */
export function SettingsCoordinatorsOnly({ clubId }: { clubId: number }) {
  return <NotAllowed clubId={clubId} message="Only the club's coordinators change its name, rules and fees. If something needs changing, tell one of them." />;
}
