import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { FindingListSchema } from '@shared/schemas/findings';
import { apiFetch } from '@/lib/api/client';
import { clubFindingsKeys, type ClubFindingFilters } from './club-findings-keys';

/** The filters as the server reads them: `seasonId`, `siteId`, `severity`, `kind`, only those that are set. */
export function clubFindingsQuery({ seasonId, siteId, severity, kind }: Omit<ClubFindingFilters, 'clubId'>): string {
  const q = new URLSearchParams();
  if (seasonId) q.set('seasonId', String(seasonId));
  if (siteId) q.set('siteId', String(siteId));
  if (severity) q.set('severity', severity);
  if (kind) q.set('kind', kind);
  const text = q.toString();
  return text ? `?${text}` : '';
}

/** GET /api/clubs/:clubId/findings?seasonId=&siteId=&severity=&kind= (coordinators): the season's findings of the club. */
export function getClubFindings({ clubId, ...filters }: ClubFindingFilters, signal?: AbortSignal) {
  return apiFetch(`/api/clubs/${clubId}/findings${clubFindingsQuery(filters)}`, { schema: FindingListSchema, signal });
}

/** GET /api/clubs/:clubId/findings/export.csv with the same filters: the table as a CSV download. */
export function clubFindingsCsvUrl({ clubId, ...filters }: ClubFindingFilters): string {
  return `/api/clubs/${clubId}/findings/export.csv${clubFindingsQuery(filters)}`;
}

/** Query options for the club's findings with the table's filters. */
export function clubFindingsQueryOptions(filters: ClubFindingFilters) {
  return queryOptions({ queryKey: clubFindingsKeys.club(filters), queryFn: ({ signal }) => getClubFindings(filters, signal) });
}

/** The club's findings; while other filters load, the last answer stays on screen. */
export function useClubFindings(filters: ClubFindingFilters) {
  return useQuery({ ...clubFindingsQueryOptions(filters), placeholderData: keepPreviousData });
}
