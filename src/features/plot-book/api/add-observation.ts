import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ObservationSchema, type ObservationBody } from '@shared/schemas/plot-book';
import { apiFetch } from '@/lib/api/client';
import { plotBookKeys } from './keys';

export type ObservationInput = Partial<ObservationBody> & Pick<ObservationBody, 'severity' | 'observedOn'>;

/** POST /api/plots/:plotId/observations: a pest or disease seen on the plot. */
export function addObservation(plotId: number, body: ObservationInput) {
  return apiFetch(`/api/plots/${plotId}/observations`, { method: 'POST', body, schema: ObservationSchema });
}

/** POST /api/observations/:observationId/photos (multipart `photo`): one photo; the server checks and re-encodes it. */
export function addObservationPhoto(observationId: number, photo: File) {
  const form = new FormData();
  form.append('photo', photo);
  return apiFetch(`/api/observations/${observationId}/photos`, { method: 'POST', body: form, schema: ObservationSchema });
}

/**
 * Records an observation, then uploads its photos one by one. When a photo is refused the observation
 * is kept and the error says which photo, so nothing typed is lost.
 */
export function useAddObservation(plotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ body, photos }: { body: ObservationInput; photos: File[] }) => {
      let observation = await addObservation(plotId, body);
      for (const photo of photos) {
        try {
          observation = await addObservationPhoto(observation.id, photo);
        } catch (error) {
          throw Object.assign(error as Error, { savedObservation: observation, photoName: photo.name });
        }
      }
      return observation;
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: plotBookKeys.plot(plotId) }),
  });
}
