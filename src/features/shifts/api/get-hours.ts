import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { HoursTableSchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';
import { shiftsKeys } from './keys';

const yearQuery = (year: number | null) => (year === null ? '' : `?year=${year}`);

/** GET /api/clubs/:clubId/hours?year (coordinators): each volunteer's shifts done and hours in a season, against the club's ask. */
export function getHours(clubId: number, year: number | null, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/hours${yearQuery(year)}`, { schema: HoursTableSchema, signal });
}

/** GET /api/clubs/:clubId/hours.csv?year: the same table as a CSV download. */
export function hoursCsvUrl(clubId: number, year: number | null): string {
  return `/api/clubs/${clubId}/hours.csv${yearQuery(year)}`;
}

/** Query options for a season's hours; null asks for the server's current season. */
export function hoursQueryOptions(clubId: number, year: number | null) {
  return queryOptions({ queryKey: shiftsKeys.hours(clubId, year), queryFn: ({ signal }) => getHours(clubId, year, signal) });
}

/** A season's hours; the last year's table stays while another year loads. */
export function useHours(clubId: number, year: number | null) {
  return useQuery({ ...hoursQueryOptions(clubId, year), placeholderData: keepPreviousData });
}
