import { useParams } from 'react-router-dom';
import { SearchX } from 'lucide-react';
import { parseIdText } from '@shared/schemas/common';
import { DeadEnd } from '@/components/ui/dead-end';
import { ShiftPage } from '@/features/shifts/components/shift-page';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/shifts/:shiftId`: one shift, for every member; coordinators also manage it here. */
export function ShiftRoute() {
  const { club } = useClubContext();
  const shiftId = parseIdText(useParams().shiftId);
  if (shiftId === null) {
    return (
      <DeadEnd clubId={club.clubId} icon={SearchX} title="This shift isn't here">
        <p>The link is not one of ours. Open the shift from the board or from its e-mail.</p>
      </DeadEnd>
    );
  }
  const roles = club.roles;
  return (
    <ShiftPage
      key={shiftId}
      clubId={club.clubId}
      clubName={club.clubName}
      shiftId={shiftId}
      canClaim={roles.includes('volunteer') || roles.includes('coordinator')}
      isCoordinator={roles.includes('coordinator')}
    />
  );
}
