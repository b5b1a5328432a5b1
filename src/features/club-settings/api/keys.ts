/** Query keys for club settings: `['club-settings']`, `['club-settings', 'detail', clubId]`. */
export const clubSettingsKeys = {
  all: ['club-settings'] as const,
  details: () => [...clubSettingsKeys.all, 'detail'] as const,
  detail: (clubId: number) => [...clubSettingsKeys.details(), clubId] as const,
};
