import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { weatherKeys } from './keys';

/** DELETE /api/sites/:siteId/weather/:day: the whole day (coordinators). */
export function deleteWeatherDay(siteId: number, day: string): Promise<undefined> {
  return apiFetch(`/api/sites/${siteId}/weather/${day}`, { method: 'DELETE' });
}

/** Deletes one day of a site's log and refreshes the log. */
export function useDeleteWeatherDay(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // The server re-plans the site's tasks with this write; the app reads its task lists again (src/app/providers.tsx).
    meta: { replansTasks: true },
    mutationFn: (day: string) => deleteWeatherDay(siteId, day),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.site(siteId) }),
  });
}
