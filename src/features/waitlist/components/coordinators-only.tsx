import { NotAllowed } from '@/components/ui/not-allowed';

/** Shown instead of a coordinators' page (waiting list, messages) to someone who is not a coordinator of the club. */
export function CoordinatorsOnly({ clubId }: { clubId: number }) {
  return <NotAllowed clubId={clubId} message="This page holds people's contact details, so only the club's coordinators see it." />;
}
