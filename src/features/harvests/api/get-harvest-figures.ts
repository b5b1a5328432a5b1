import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { HarvestFiguresSchema } from '@shared/schemas/harvest-figures';
import { apiFetch } from '@/lib/api/client';
import { harvestsKeys } from './keys';

/** GET /api/clubs/:clubId/harvest-figures: the club's harvest per crop for a season (this season when `year` is left out). */
export function getHarvestFigures({ clubId, year }: { clubId: number; year?: number }, signal?: AbortSignal) {
  const query = year ? `?year=${year}` : '';
  return apiFetch(`/api/clubs/${clubId}/harvest-figures${query}`, { schema: HarvestFiguresSchema, signal });
}

/** Query options for one season's harvest figures. */
export function harvestFiguresQueryOptions(filters: { clubId: number; year?: number }) {
  return queryOptions({ queryKey: harvestsKeys.detail(filters), queryFn: ({ signal }) => getHarvestFigures(filters, signal) });
}

/** A season's harvest figures; while another season loads, the last one stays on screen. */
export function useHarvestFigures(filters: { clubId: number; year?: number }) {
  return useQuery({ ...harvestFiguresQueryOptions(filters), placeholderData: keepPreviousData });
}
