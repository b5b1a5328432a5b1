import { Link } from 'react-router-dom';
import { ShieldBan } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/lib/paths';

/** Shown instead of a coordinators' page (waitlist, messages) to someone who is not a coordinator of the club. */
export function CoordinatorsOnly({ clubId }: { clubId: number }) {
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
      <p>This page holds people's contact details, so only the club's coordinators see it.</p>
    </EmptyState>
  );
}
