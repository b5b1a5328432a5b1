import type { UnitSystem } from '@shared/geometry';

/** GET /api/sites/:siteId/plots.csv: the site's plots as a CSV download, lengths in the given units. */
export function plotsCsvUrl(siteId: number, units: UnitSystem): string {
  return `/api/sites/${siteId}/plots.csv?units=${units}`;
}

/** GET /api/sites/:siteId/plot-imports/template.csv: a starting file with the columns and two example plots. */
export function plotsTemplateUrl(siteId: number, units: UnitSystem): string {
  return `/api/sites/${siteId}/plot-imports/template.csv?units=${units}`;
}
