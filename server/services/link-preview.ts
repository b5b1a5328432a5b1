import { area, formatArea, formatLength } from '@shared/geometry';
import { plotKindLabels } from '@shared/schemas/plots';
import type { Db } from '../db/knex';

/** The plot facts shown on an offer or renewal page and in its e-mail, in the site's units. */
export async function plotFacts(db: Db, plotId: number) {
  const p = await db('plots as p')
    .join('sites as s', 's.id', 'p.site_id')
    .where('p.id', plotId)
    .first('p.*', 's.name as site_name', 's.units');
  const rect = { x: p.x_m, y: p.y_m, width: p.width_m, length: p.length_m, rotation: p.rotation };
  return {
    label: p.label as string,
    siteName: p.site_name as string,
    size: `${formatLength(p.width_m, p.units)} × ${formatLength(p.length_m, p.units)}`,
    area: formatArea(area(rect), p.units),
    kind: plotKindLabels[p.kind as keyof typeof plotKindLabels],
  };
}
