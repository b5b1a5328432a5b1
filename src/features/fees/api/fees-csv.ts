/** GET /api/clubs/:clubId/fees.csv: the season's fees (or every season's) as a CSV download. */
export function feesCsvUrl(clubId: number, year?: number): string {
  return `/api/clubs/${clubId}/fees.csv${year ? `?year=${year}` : ''}`;
}
