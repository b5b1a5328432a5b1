import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { WeatherLogSchema } from '@shared/schemas/weather';
import { apiFetch } from '@/lib/api/client';
import { weatherKeys } from './keys';

/** GET /api/sites/:siteId/weather?from=&to=: the days of a range (the last eight weeks by default), newest first, in SI. */
export function getWeatherLog(siteId: number, range: { from?: string; to?: string } = {}, signal?: AbortSignal) {
  const query = new URLSearchParams();
  if (range.from) query.set('from', range.from);
  if (range.to) query.set('to', range.to);
  const qs = query.toString();
  return apiFetch(`/api/sites/${siteId}/weather${qs ? `?${qs}` : ''}`, { schema: WeatherLogSchema, signal });
}

/** Query options for a range of a site's weather log. */
export function weatherLogQueryOptions(siteId: number, range: { from?: string; to?: string } = {}) {
  return queryOptions({
    queryKey: weatherKeys.log({ siteId, ...range }),
    queryFn: ({ signal }) => getWeatherLog(siteId, range, signal),
  });
}

/** A site's weather log for a range; the previous range stays on screen while the next one loads. */
export function useWeatherLog(siteId: number, range: { from?: string; to?: string } = {}, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...weatherLogQueryOptions(siteId, range), enabled, placeholderData: keepPreviousData });
}
