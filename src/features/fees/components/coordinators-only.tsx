import { NotAllowed } from '@/components/ui/not-allowed';

/** Shown instead of the club's fee list to someone who is not a coordinator; their own fees are on the club home. */
export function FeesCoordinatorsOnly({ clubId }: { clubId: number }) {
  return <NotAllowed clubId={clubId} message="Only the club's coordinators see everyone's fees and record payments. Your own fees are on the club home page." />;
}
