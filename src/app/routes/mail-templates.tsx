import { MailTemplatesPage } from '@/features/outbox/components/mail-templates-page';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/outgoing-mail/templates`: coordinators preview every e-mail template with the club's sample data. */
export function MailTemplatesRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="people" />;
  return <MailTemplatesPage clubId={club.clubId} clubName={club.clubName} />;
}
