import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Link2Off } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';

export interface LinkProblemProps {
  title: string;
  children: ReactNode;
  actionLabel: string;
  actionHref: string;
}

/** The designed dead end for e-mailed links that are broken, used or expired. */
export function LinkProblem({ title, children, actionLabel, actionHref }: LinkProblemProps) {
  return (
    <EmptyState
      icon={Link2Off}
      title={title}
      headingLevel="h1"
      action={
        <Link to={actionHref} className={buttonClasses('primary')}>
          {actionLabel}
        </Link>
      }
    >
      {children}
    </EmptyState>
  );
}
