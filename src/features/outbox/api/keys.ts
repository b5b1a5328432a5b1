import type { OutboxQuery } from '@shared/schemas/outbox';

/** Query keys for a club's outgoing mail: `['outbox', 'list', { clubId, status, page }]`; templates `['outbox', 'templates', { clubId }, name?]`. */
export const outboxKeys = {
  all: ['outbox'] as const,
  lists: () => [...outboxKeys.all, 'list'] as const,
  clubLists: (clubId: number) => [...outboxKeys.lists(), { clubId }] as const,
  list: (filters: { clubId: number } & OutboxQuery) => [...outboxKeys.lists(), filters] as const,
  templates: (clubId: number) => [...outboxKeys.all, 'templates', { clubId }] as const,
  preview: (clubId: number, name: string) => [...outboxKeys.all, 'templates', { clubId }, name] as const,
};
