import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { FullPage } from '../full-page';
import { NotFoundRoute } from './not-found';

/** Catches render and loading errors below the root route; a reload fixes most (e.g. a new deploy). */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundRoute />;
  return (
    <FullPage>
      <ErrorState
        headingLevel="h1"
        title="Something went wrong"
        message="This page hit a snag. Reloading usually sorts it out."
        onRetry={() => window.location.reload()}
      />
    </FullPage>
  );
}
