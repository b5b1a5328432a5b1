import { z } from 'zod';
import { TaskSchema, type TaskStatusBodySchema } from '@shared/schemas/tasks';
import { apiFetch } from '@/lib/api/client';

/** The body of done, reopen and skip: the version last read, and a note kept with a done task. */
export type TaskStatusBody = z.input<typeof TaskStatusBodySchema>;

/** The three status changes a task takes, by the last part of their path. */
export type TaskStatusAction = 'done' | 'reopen' | 'skip';

/** POST /api/tasks/:taskId/<action> with {version, note}; 409 when someone changed the task since it was read. */
export function postTaskStatus(taskId: number, action: TaskStatusAction, body: TaskStatusBody, idempotencyKey?: string) {
  return apiFetch(`/api/tasks/${taskId}/${action}`, { method: 'POST', body: taskStatusBody(body), schema: TaskSchema, idempotencyKey });
}

/** What the three status changes send: the version and the note (empty when none). */
export function taskStatusBody(body: TaskStatusBody) {
  return { version: body.version, note: body.note ?? '' };
}
