/** GET /api/clubs/:clubId/exports/waitlist.csv: everyone waiting or offered, in queue order. */
export function waitlistCsvUrl(clubId: number): string {
  return `/api/clubs/${clubId}/exports/waitlist.csv`;
}

/** GET /api/clubs/:clubId/waitlist-imports/template.csv: a starting file with two examples. */
export function waitlistTemplateUrl(clubId: number): string {
  return `/api/clubs/${clubId}/waitlist-imports/template.csv`;
}
