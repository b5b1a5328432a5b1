import type { ReactNode } from 'react';

export interface PageHeaderProps {
  title: ReactNode;
  /** A small line above the title, e.g. the club name. */
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}

/** The page's one h1 with optional eyebrow, description and actions. */
export function PageHeader({ title, eyebrow, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-col gap-4 sm:mb-8 sm:flex-row sm:items-end sm:justify-between">
      <div className="min-w-0">
        {eyebrow && <p className="text-sm font-semibold tracking-wide text-leaf uppercase">{eyebrow}</p>}
        <h1 className="text-2xl font-bold break-words sm:text-3xl">{title}</h1>
        {description && <div className="mt-2 max-w-2xl text-stone">{description}</div>}
      </div>
      {actions && <div className="flex shrink-0 flex-wrap gap-3">{actions}</div>}
    </header>
  );
}
