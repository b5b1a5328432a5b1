import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { TaskCreateBody } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';
import { invalidateTaskLists } from './invalidate';

/** The answer to a new coordinator's task: how many tasks it made (more than one when it repeats). */
export const TasksCreatedSchema = z.object({ created: z.number().int() });

/** POST /api/sites/:siteId/tasks {plotId, kind, title, details, dueOn, windowDays, repeatEveryDays, repeatUntil} (coordinators). */
export function createSiteTask(siteId: number, body: TaskCreateBody) {
  return apiFetch(`/api/sites/${siteId}/tasks`, { method: 'POST', body, schema: TasksCreatedSchema });
}

/** Adds a shared-bed or site task, once or repeating, and reads the lists again. */
export function useCreateSiteTask(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TaskCreateBody) => createSiteTask(siteId, body),
    onSuccess: () => invalidateTaskLists(queryClient),
  });
}
