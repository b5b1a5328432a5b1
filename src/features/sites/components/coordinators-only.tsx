import { NotAllowed } from '@/components/ui/not-allowed';

/** Shown instead of a site-management page to someone who is not a coordinator of the club. */
export function CoordinatorsOnly({ clubId }: { clubId: number }) {
  return <NotAllowed clubId={clubId} message="Only the club's coordinators add and change sites. If a site's details look wrong, tell one of them." />;
}
