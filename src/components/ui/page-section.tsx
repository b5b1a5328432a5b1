import type { ReactNode } from 'react';
import { Card } from './card';

/** A titled part of a page (h2), named by its heading for screen readers and reachable by its id. */
export function PageSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="min-w-0">
      <h2 id={id} className="mb-4 scroll-mt-6 text-xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** A titled part of a page drawn as a card, named by its heading for screen readers. */
export function CardSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="min-w-0">
      <Card className="h-full">
        <h2 id={id} className="mb-4 text-xl font-semibold">
          {title}
        </h2>
        {children}
      </Card>
    </section>
  );
}
