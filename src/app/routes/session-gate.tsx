import type { ReactNode } from 'react';
import type { SessionInfo } from '@shared/schemas/auth';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { useSession } from '@/features/auth/api/get-session';
import { FullPage } from '../full-page';

/** Waits for the first session answer; later refetch failures keep showing the last good session. */
export function SessionGate({ children }: { children: (session: SessionInfo) => ReactNode }) {
  const session = useSession();
  if (session.data) return children(session.data);
  if (session.isError) {
    return (
      <FullPage>
        <ErrorState
          headingLevel="h1"
          title="Tillwell didn't open"
          message={session.error.message}
          onRetry={() => void session.refetch()}
          retrying={session.isFetching}
        />
      </FullPage>
    );
  }
  return <LoadingState fullPage label="Opening Tillwell…" />;
}
