import { MutationCache, QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { markSignedOut } from '@/features/auth/api/get-session';
import { invalidateAfterReplan } from '@/features/tasks/api/invalidate';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { router } from './router';

// Pages that are fine to show a signed-out person; a 401 there must not bounce anywhere.
const openPaths = new Set(['/sign-in', '/forgot-password', '/reset-password', '/invite', '/shift-link']);

function shouldRetry(failureCount: number, error: unknown): boolean {
  // A 4xx answer will not change by asking again; network trouble and 5xx might.
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/** The app's one QueryClient; a 401 from any query signs the person out and sends them to /sign-in. */
export const queryClient: QueryClient = new QueryClient({
  queryCache: new QueryCache({
    onError: (error) => {
      if (!isApiError(error, 401)) return;
      void markSignedOut(queryClient);
      if (!openPaths.has(router.state.location.pathname)) void router.navigate(paths.signIn(), { replace: true });
    },
  }),
  // Weather and planting writes re-plan the site's tasks on the server in the same transaction; the features that
  // make them mark them `meta.replansTasks` (they do not know the tasks feature), and the task lists are read again here.
  mutationCache: new MutationCache({
    onSuccess: (_data, _variables, _result, mutation) => {
      // Not awaited: the write's own success shows at once; the lists refresh behind it.
      if (mutation.meta?.replansTasks) void invalidateAfterReplan(queryClient);
    },
  }),
  defaultOptions: {
    queries: { retry: shouldRetry, staleTime: 30_000 },
    mutations: { retry: false },
  },
});

/** Wraps the router in the query client; main.tsx renders only this. */
export function AppProviders() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
