/** GET /api/clubs/:clubId/exports/members.csv: everyone in the club with their roles. */
export function membersCsvUrl(clubId: number): string {
  return `/api/clubs/${clubId}/exports/members.csv`;
}

/** GET /api/clubs/:clubId/exports/allocations.csv: who held which plot, for one year or all. */
export function allocationsCsvUrl(clubId: number, year?: number): string {
  return `/api/clubs/${clubId}/exports/allocations.csv${year ? `?year=${year}` : ''}`;
}

/** GET /api/clubs/:clubId/member-imports/template.csv: a starting file with two examples. */
export function membersTemplateUrl(clubId: number): string {
  return `/api/clubs/${clubId}/member-imports/template.csv`;
}
