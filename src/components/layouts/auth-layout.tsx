import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Wordmark } from './logo';

/** Signed-out pages: the name, our tagline and one centred card. */
export function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <main className="flex flex-1 flex-col items-center px-4 pt-10 pb-8 sm:pt-16">
        <div className="mb-8 flex flex-col items-center text-center">
          <Link to="/" className="rounded-lg no-underline" aria-label="Tillwell home">
            <Wordmark size="lg" />
          </Link>
          <p className="mt-2 text-stone">Shared ground, well tended.</p>
        </div>
        <div className="w-full max-w-md rounded-2xl border border-paper-200 bg-white p-6 shadow-sm sm:p-8">
          {children}
        </div>
      </main>
      <div aria-hidden="true" className="h-3 border-t-4 border-shoot bg-soil" />
    </div>
  );
}
