import { z } from 'zod';

export const waitlistMoveKindLabels: Record<string, string> = {
  reordered: 'Moved by the coordinator',
  removed: 'Removed',
  declined_moved: 'Declined an offer; moved to the end',
  lapsed_moved: 'Did not answer an offer; moved to the end',
};

/** One recorded change to someone's place in the queue. */
export const WaitlistMoveSchema = z.object({
  id: z.number().int(),
  kind: z.string(),
  fromPosition: z.number().int().nullable(),
  toPosition: z.number().int().nullable(),
  reason: z.string(),
  byName: z.string().nullable(),
  createdAt: z.string(),
});
export type WaitlistMove = z.infer<typeof WaitlistMoveSchema>;
