import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { TaskKindSchema, type HandoverBodySchema } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';
import { invalidateTaskLists } from './invalidate';

export type HandoverBody = z.input<typeof HandoverBodySchema>;

/** The answer to a new handover: the period as saved and how many tasks it handed to the volunteers. */
export const HandoverCreatedSchema = z.object({
  id: z.number().int(),
  fromOn: z.string(),
  toOn: z.string(),
  kinds: z.array(TaskKindSchema),
  note: z.string(),
  tasksHanded: z.number().int(),
});
export type HandoverCreated = z.infer<typeof HandoverCreatedSchema>;

/** POST /api/plots/:plotId/handovers {fromOn, toOn, kinds, note}: the holder is away and asks the volunteers to cover. */
export function createHandover(plotId: number, body: HandoverBody) {
  return apiFetch(`/api/plots/${plotId}/handovers`, { method: 'POST', body, schema: HandoverCreatedSchema });
}

/** Hands a period's tasks to the volunteers and reads the plot's tasks again. */
export function useCreateHandover(plotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: HandoverBody) => createHandover(plotId, body),
    onSuccess: () => invalidateTaskLists(queryClient),
  });
}
