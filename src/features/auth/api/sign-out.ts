import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch, isApiError } from '@/lib/api/client';
import { authKeys } from './keys';
import { markSignedOut } from './get-session';

/** DELETE /api/session: ends the session. */
export function signOut(): Promise<undefined> {
  return apiFetch('/api/session', { method: 'DELETE' });
}

/** Signs out, empties the cache of the person's data and fetches a new session (and CSRF token). */
export function useSignOut() {
  const queryClient = useQueryClient();
  const forget = async () => {
    queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
    await markSignedOut(queryClient);
  };
  return useMutation({
    mutationFn: signOut,
    onSuccess: forget,
    // A 401 means the session had already ended; the person is signed out either way.
    onError: (error) => (isApiError(error, 401) ? forget() : undefined),
  });
}
