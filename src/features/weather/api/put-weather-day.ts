import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { WeatherDayBodySchema, WeatherDaySchema, type WeatherDayBody } from '@shared/schemas/weather';
import { apiFetch } from '@/lib/api/client';
import { weatherKeys } from './keys';

/** What the forms send: any of the values in SI (left out keeps, null clears) and which form sent them. */
export type WeatherDayInput = z.input<typeof WeatherDayBodySchema>;

/** PUT /api/sites/:siteId/weather/:day: merges the values into the day (201 when the day is new). */
export function putWeatherDay(siteId: number, day: string, body: WeatherDayInput | WeatherDayBody, idempotencyKey?: string) {
  return apiFetch(weatherDayPath(siteId, day), { method: 'PUT', body, schema: WeatherDaySchema, idempotencyKey });
}

export const weatherDayPath = (siteId: number, day: string) => `/api/sites/${siteId}/weather/${day}`;

/** Saves values for one day of a site's log and refreshes every range of that log. */
export function usePutWeatherDay(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: ({ day, body, key }: { day: string; body: WeatherDayInput; key?: string }) => putWeatherDay(siteId, day, body, key),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.site(siteId) }),
  });
}
