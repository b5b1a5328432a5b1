import { NotAllowed } from '@/components/ui/not-allowed';

/** Shown when the server answers 403: the person is in the club but not a coordinator. */
export function MembersNotAllowed({ clubId }: { clubId: number }) {
  return <NotAllowed clubId={clubId} message="Only the club's coordinators can see the member list and send invites. If something here needs changing, ask one of them." />;
}
