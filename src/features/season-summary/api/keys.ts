/** Query keys for the season at a glance: `['season-summary']`, `['season-summary', clubId]`. */
export const seasonSummaryKeys = {
  all: ['season-summary'] as const,
  detail: (clubId: number) => [...seasonSummaryKeys.all, clubId] as const,
};
