import { Link } from 'react-router-dom';
import { ShieldBan } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/lib/paths';

/** Shown when the server answers 403: the person is in the club but not a coordinator. */
export function NotAllowed({ clubId }: { clubId: number }) {
  return (
    <EmptyState
      icon={ShieldBan}
      title="This page is for coordinators"
      headingLevel="h1"
      action={
        <Link to={paths.club(clubId)} className={buttonClasses('secondary')}>
          Back to club home
        </Link>
      }
    >
      <p>Only the club's coordinators can see the member list and send invites. If something here needs changing, ask one of them.</p>
    </EmptyState>
  );
}
