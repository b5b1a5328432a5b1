/** Filters that pick one list in this feature; each club has a members list and an invites list. */
export interface MembersListFilters {
  clubId: number;
  kind: 'members' | 'invites';
}

/** Query keys for the members feature: `['members']`, `['members', 'list', filters]`, `['members', 'detail', id]`. */
export const membersKeys = {
  all: ['members'] as const,
  lists: () => [...membersKeys.all, 'list'] as const,
  list: (filters: MembersListFilters) => [...membersKeys.lists(), filters] as const,
  details: () => [...membersKeys.all, 'detail'] as const,
  detail: (id: number) => [...membersKeys.details(), id] as const,
};
