import { keepPreviousData, skipToken, useQuery } from '@tanstack/react-query';
import { PlantingCheckResultSchema } from '@shared/schemas/findings';
import type { PlantingCheckBody } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { useDebouncedValue } from '../lib/use-debounced-value';
import { findingsKeys } from './keys';

/** A planting as the form holds it; the server fills the rest from PlantingCheckBodySchema's defaults. */
export type PlantingCheckInput = Partial<PlantingCheckBody> & Pick<PlantingCheckBody, 'cropId' | 'method' | 'plantedOn'>;

/** How long the form must be still before the draft is checked. */
export const CHECK_DELAY_MS = 400;

/** POST /api/plots/:plotId/plantings/check: the findings the planting would have, without saving it. */
export function checkPlanting(plotId: number, body: PlantingCheckInput, signal?: AbortSignal) {
  return apiFetch(`/api/plots/${plotId}/plantings/check`, { method: 'POST', body, schema: PlantingCheckResultSchema, signal });
}

/**
 * The dry run of a draft planting, asked once the form has been still for CHECK_DELAY_MS; null (no crop or date yet)
 * asks nothing. While a newer draft is checked the last findings stay on screen; `checking` covers the wait too.
 */
export function usePlantingCheck(plotId: number, draft: PlantingCheckInput | null) {
  const { value: settled, settling } = useDebouncedValue(draft, CHECK_DELAY_MS);
  const query = useQuery({
    queryKey: findingsKeys.check(plotId, settled),
    queryFn: settled ? ({ signal }) => checkPlanting(plotId, settled, signal) : skipToken,
    placeholderData: keepPreviousData,
    // A refused draft (a 400 on a half-filled box) is not worth asking again; the next change asks anew.
    retry: false,
  });
  const active = draft !== null;
  return { ...query, active, checking: active && (settling || query.isFetching) };
}
