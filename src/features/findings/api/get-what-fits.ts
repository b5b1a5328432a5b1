import { keepPreviousData, skipToken, useQuery } from '@tanstack/react-query';
import { WhatFitsResultSchema } from '@shared/schemas/findings';
import type { PlotPart } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { useDebouncedValue } from '../lib/use-debounced-value';
import { findingsKeys } from './keys';

export interface WhatFitsQuery {
  /** YYYY-MM-DD, the day of sowing or planting out. */
  date: string;
  /** A part of the plot, or null for the whole plot. */
  part: PlotPart | null;
  /** Changes whenever the plot's plantings change, so a saved planting asks again. */
  plantingsStamp?: string;
}

function whatFitsQueryString({ date, part }: WhatFitsQuery): string {
  const params = new URLSearchParams({ date });
  if (part) {
    params.set('x', String(part.x));
    params.set('y', String(part.y));
    params.set('width', String(part.width));
    params.set('length', String(part.length));
  }
  return params.toString();
}

/** GET /api/plots/:plotId/what-fits?date=&x=&y=&width=&length=: the club's crops ranked for this plot (or part), best first. */
export function getWhatFits(plotId: number, query: WhatFitsQuery, signal?: AbortSignal) {
  return apiFetch(`/api/plots/${plotId}/what-fits?${whatFitsQueryString(query)}`, { schema: WhatFitsResultSchema, signal });
}

/** What fits the plot on a date; null asks nothing. A part being dragged is asked once it is still; the last list stays meanwhile. */
export function useWhatFits(plotId: number, query: WhatFitsQuery | null) {
  const { value: settled, settling } = useDebouncedValue(query, 400);
  const result = useQuery({
    queryKey: findingsKeys.whatFits(plotId, settled),
    queryFn: settled ? ({ signal }) => getWhatFits(plotId, settled, signal) : skipToken,
    placeholderData: keepPreviousData,
  });
  return { ...result, checking: query !== null && (settling || result.isFetching) };
}
