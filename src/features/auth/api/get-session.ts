import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { SessionInfo } from '@shared/schemas/auth';
import { apiFetch } from '@/lib/api/client';
import { SessionInfoShape } from '@/lib/api/response-shapes.gen';
import { authKeys } from './keys';

/** GET /api/session: who is signed in, plus a fresh CSRF token. */
export function getSession(signal?: AbortSignal): Promise<SessionInfo> {
  return apiFetch('/api/session', { schema: SessionInfoShape, signal });
}

/** Query options for the session, shared by the hook and by code that prefetches or refetches it. */
export function sessionQueryOptions() {
  return queryOptions({
    queryKey: authKeys.session(),
    queryFn: ({ signal }) => getSession(signal),
    staleTime: 60_000,
  });
}

/** The current session; `data.user` is null when nobody is signed in. */
export function useSession() {
  return useQuery(sessionQueryOptions());
}

/** Forgets the signed-in person at once (the guards react), then asks the server for the new session. */
export async function markSignedOut(queryClient: QueryClient): Promise<void> {
  queryClient.setQueryData<SessionInfo>(authKeys.session(), (old) => (old ? { ...old, user: null } : old));
  await queryClient.invalidateQueries({ queryKey: authKeys.session() });
}

/** Stores a session the server just handed back and drops every other cached answer, which belonged to someone else. */
export function storeSession(queryClient: QueryClient, session: SessionInfo): void {
  queryClient.setQueryData(authKeys.session(), session);
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
}
