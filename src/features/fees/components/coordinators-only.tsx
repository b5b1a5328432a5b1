import { Link } from 'react-router-dom';
import { ShieldBan } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/lib/paths';

/** Shown instead of the club's fee list to someone who is not a coordinator; their own fees are on the club home. */
export function FeesCoordinatorsOnly({ clubId }: { clubId: number }) {
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
      <p>Only the club's coordinators see everyone's fees and record payments. Your own fees are on the club home page.</p>
    </EmptyState>
  );
}
