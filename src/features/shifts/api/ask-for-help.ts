import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { AskForHelpResultSchema, type AskForHelpBodySchema } from '@shared/schemas/shifts';
import { apiFetch } from '@/lib/api/client';

export type AskForHelpBody = z.input<typeof AskForHelpBodySchema>;
export type AskForHelpResult = z.infer<typeof AskForHelpResultSchema>;

/** POST /api/shifts/:shiftId/ask-for-help {note} (coordinators): e-mails the club's volunteers a link to take a place. */
export function askForHelp(shiftId: number, body: AskForHelpBody, idempotencyKey?: string) {
  return apiFetch(`/api/shifts/${shiftId}/ask-for-help`, { method: 'POST', body, schema: AskForHelpResultSchema, idempotencyKey });
}

/** Sends the help e-mails; the answer counts those sent and those left out. */
export function useAskForHelp(shiftId: number) {
  return useMutation({
    mutationFn: ({ body, idempotencyKey }: { body: AskForHelpBody; idempotencyKey?: string }) => askForHelp(shiftId, body, idempotencyKey),
  });
}
