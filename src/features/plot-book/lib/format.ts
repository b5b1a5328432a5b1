import { formatDate } from '@shared/dates';
import { formatArea, formatLength, type UnitSystem } from '@shared/geometry';
import type { Planting, PlotPart, plantingStatuses } from '@shared/schemas/plot-book';

type PlantingStatus = (typeof plantingStatuses)[number];

/** A calendar date (YYYY-MM-DD, already the site's day) as people read it: "12 Apr 2026". */
export function calendarDate(iso: string): string {
  return formatDate(`${iso}T00:00:00Z`, 'UTC');
}

/** Two calendar dates as one span: "12 Apr 2026 to 20 Apr 2026", or one date when they are the same. */
export function dateSpan(from: string, to: string): string {
  if (from === to) return calendarDate(from);
  return `${calendarDate(from)} to ${calendarDate(to)}`;
}

/** Where on the plot a planting or observation is, in the site's units. */
export function partText(part: PlotPart | null, units: UnitSystem): string {
  if (!part) return 'The whole plot';
  const l = (m: number) => formatLength(m, units, 2);
  return `${l(part.width)} × ${l(part.length)}, from ${l(part.x)} across and ${l(part.y)} down`;
}

export const statusWords: Record<PlantingStatus, string> = {
  planned: 'Planned',
  sown: 'Sown',
  up: 'Up',
  harvesting: 'Harvesting',
  finished: 'Finished',
  failed: 'Did not make it',
};

/** A planting's name as the plot book says it: "Radish 'French Breakfast'". */
export function plantingName(p: Pick<Planting, 'crop' | 'variety'>): string {
  return p.variety ? `${p.crop.commonName} ‘${p.variety}’` : p.crop.commonName;
}

/** Square metres, or square feet to one decimal on US sites. */
export function areaText(m2: number, units: UnitSystem): string {
  return formatArea(m2, units, units === 'us' ? 1 : 2);
}
