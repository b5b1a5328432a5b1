import { queryOptions, useQuery } from '@tanstack/react-query';
import { WeatherSitesSchema } from '@shared/schemas/weather';
import { apiFetch } from '@/lib/api/client';
import { weatherKeys } from './keys';

/** GET /api/clubs/:clubId/weather-sites: the club's sites with their units, zone, today and whether the person may log weather there. */
export function getWeatherSites(clubId: number, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/weather-sites`, { schema: WeatherSitesSchema, signal });
}

/** Query options for the sites the rain gauge can log for. */
export function weatherSitesQueryOptions(clubId: number) {
  return queryOptions({ queryKey: weatherKeys.sites(clubId), queryFn: ({ signal }) => getWeatherSites(clubId, signal) });
}

/** The club's sites as the rain gauge sees them. */
export function useWeatherSites(clubId: number) {
  return useQuery(weatherSitesQueryOptions(clubId));
}
