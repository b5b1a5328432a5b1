import { OutgoingMailPage } from '@/features/outbox/components/outgoing-mail-page';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/outgoing-mail`: coordinators see the club's e-mail that failed, is waiting or went, and resend. */
export function OutgoingMailRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="people" />;
  return <OutgoingMailPage clubId={club.clubId} clubName={club.clubName} />;
}
