import type { z } from 'zod';
import type { WaitlistQuerySchema } from '@shared/schemas/applications';

export type WaitlistFilters = z.input<typeof WaitlistQuerySchema>;

/** Query keys for the waiting list: `['waitlist', 'list', { clubId, ...filters }]`, `['waitlist', 'history', id]`, `['waitlist', 'apply', slug]`. */
export const waitlistKeys = {
  all: ['waitlist'] as const,
  lists: () => [...waitlistKeys.all, 'list'] as const,
  list: (clubId: number, filters: WaitlistFilters) => [...waitlistKeys.lists(), { clubId, ...filters }] as const,
  history: (applicationId: number) => [...waitlistKeys.all, 'history', applicationId] as const,
  applyInfo: (slug: string) => [...waitlistKeys.all, 'apply', slug] as const,
};
