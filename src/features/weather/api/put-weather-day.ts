import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { WeatherDayBodySchema, WeatherDaySchema, type WeatherDayBody } from '@shared/schemas/weather';
import { apiFetch } from '@/lib/api/client';
import { weatherKeys } from './keys';

/** What the forms send: any of the values in SI (left out keeps, null clears) and which form sent them. */
export type WeatherDayInput = z.input<typeof WeatherDayBodySchema>;

/** PUT /api/sites/:siteId/weather/:day: merges the values into the day (201 when the day is new). */
export function putWeatherDay(siteId: number, day: string, body: WeatherDayInput | WeatherDayBody) {
  return apiFetch(`/api/sites/${siteId}/weather/${day}`, { method: 'PUT', body, schema: WeatherDaySchema });
}

/** Saves values for one day of a site's log and refreshes every range of that log. */
export function usePutWeatherDay(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: ({ day, body }: { day: string; body: WeatherDayInput }) => putWeatherDay(siteId, day, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.site(siteId) }),
  });
}
