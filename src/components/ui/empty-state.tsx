import type { LucideIcon } from 'lucide-react';
import type { ReactNode } from 'react';

export interface EmptyStateProps {
  icon: LucideIcon;
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  /** Heading level, so the state fits the page outline. */
  headingLevel?: 'h1' | 'h2' | 'h3';
}

/** A calm, centred message for "nothing here yet" and other dead ends. */
export function EmptyState({ icon: Icon, title, children, action, headingLevel: Heading = 'h2' }: EmptyStateProps) {
  return (
    <div className="flex flex-col items-center px-4 py-10 text-center">
      <span className="mb-4 flex size-14 items-center justify-center rounded-full bg-leaf-50 text-leaf">
        <Icon className="size-7" aria-hidden="true" />
      </span>
      <Heading className="text-xl font-semibold text-soil">{title}</Heading>
      {children && <div className="mt-2 max-w-md text-stone">{children}</div>}
      {action && <div className="mt-6 flex flex-wrap justify-center gap-3">{action}</div>}
    </div>
  );
}
