import type { QueryClient } from '@tanstack/react-query';
import { shiftsKeys } from './keys';

/** Reads the board, every open shift page, the suggestions, "my shifts" and the hours again after a shift changed. */
export function invalidateShifts(queryClient: QueryClient) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: shiftsKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: shiftsKeys.details() }),
    queryClient.invalidateQueries({ queryKey: shiftsKeys.suggestions() }),
    queryClient.invalidateQueries({ queryKey: [...shiftsKeys.all, 'mine'] }),
    queryClient.invalidateQueries({ queryKey: shiftsKeys.hoursAll() }),
  ]);
}
