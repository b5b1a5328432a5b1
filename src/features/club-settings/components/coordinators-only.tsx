import { Link } from 'react-router-dom';
import { ShieldBan } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/lib/paths';

/** Shown instead of the settings page to someone who is not a coordinator of the club. */
export function SettingsCoordinatorsOnly({ clubId }: { clubId: number }) {
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
      <p>Only the club's coordinators change its name, rules and fees. If something needs changing, tell one of them.</p>
    </EmptyState>
  );
}
