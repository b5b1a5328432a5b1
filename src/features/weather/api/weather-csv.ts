import type { UnitSystem } from '@shared/geometry';

/** GET /api/sites/:siteId/weather.csv: every day of the log as a CSV download, in the given units. */
export function weatherCsvUrl(siteId: number, units: UnitSystem): string {
  return `/api/sites/${siteId}/weather.csv?units=${units}`;
}

/** GET /api/sites/:siteId/weather-imports/template.csv: the columns and three example days. */
export function weatherTemplateUrl(siteId: number, units: UnitSystem): string {
  return `/api/sites/${siteId}/weather-imports/template.csv?units=${units}`;
}
