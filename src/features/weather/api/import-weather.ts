import { useMutation, useQueryClient } from '@tanstack/react-query';
import { WeatherImportResultSchema, type WeatherImportBody } from '@shared/schemas/weather';
import { apiFetch } from '@/lib/api/client';
import { weatherKeys } from './keys';

/** POST /api/sites/:siteId/weather-imports: checks a CSV (commit false) or saves every row or none (commit true). */
export function importWeather(siteId: number, body: WeatherImportBody) {
  return apiFetch(`/api/sites/${siteId}/weather-imports`, { method: 'POST', body, schema: WeatherImportResultSchema });
}

/** Checks or imports a weather CSV; a committed import refreshes the site's log. */
export function useImportWeather(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: (body: WeatherImportBody) => importWeather(siteId, body),
    onSuccess: async (result) => {
      if (result.committed) await queryClient.invalidateQueries({ queryKey: weatherKeys.site(siteId) });
    },
  });
}
