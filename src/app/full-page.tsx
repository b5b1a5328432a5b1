import type { ReactNode } from 'react';
import { Wordmark } from '@/components/layouts/logo';

/** A bare page with the wordmark on top, for moments before any layout can render. */
export function FullPage({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-dvh flex-col items-center justify-center px-4 py-10">
      <Wordmark size="lg" />
      <div className="mt-6 w-full max-w-md">{children}</div>
    </main>
  );
}
