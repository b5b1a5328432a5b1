import { EmailChoicesPage } from '@/features/mailings/components/email-choices-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/email-choices`: everyone's own optional e-mail choices in this club. */
export function EmailChoicesRoute() {
  const { club } = useClubContext();
  return <EmailChoicesPage key={club.clubId} clubId={club.clubId} clubName={club.clubName} />;
}
