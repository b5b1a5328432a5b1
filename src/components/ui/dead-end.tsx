import type { LucideIcon } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/lib/paths';

export interface DeadEndProps {
  clubId: number;
  icon: LucideIcon;
  title: string;
  children: ReactNode;
}

/** A whole-page dead end inside a club (not found, not allowed) whose way out is the club home. */
export function DeadEnd({ clubId, icon, title, children }: DeadEndProps) {
  return (
    <EmptyState
      icon={icon}
      title={title}
      headingLevel="h1"
      action={
        <Link to={paths.club(clubId)} className={buttonClasses('secondary')}>
          Back to club home
        </Link>
      }
    >
      {children}
    </EmptyState>
  );
}
