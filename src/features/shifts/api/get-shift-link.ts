import { queryOptions, useQuery } from '@tanstack/react-query';
import { ShiftLinkPreviewSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

/** GET /api/shift-links/preview?token=… (no sign-in): what an e-mailed shift link is for and where it stands; opening it changes nothing. */
export function getShiftLink(token: string, signal?: AbortSignal) {
  return apiFetch(`/api/shift-links/preview?token=${encodeURIComponent(token)}`, { schema: ShiftLinkPreviewSchema, signal });
}

/** Query options for an e-mailed link; a bad link is not asked about twice. */
export function shiftLinkQueryOptions(token: string) {
  return queryOptions({ queryKey: shiftsKeys.link(token), queryFn: ({ signal }) => getShiftLink(token, signal), retry: false });
}

/** The shift behind an e-mailed link; `enabled: false` when the page has no token. */
export function useShiftLink(token: string) {
  return useQuery({ ...shiftLinkQueryOptions(token), enabled: token.length > 0 });
}
