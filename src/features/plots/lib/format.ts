import { formatArea, lengthUnitLabel, METRES_PER_INCH, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';

/** A plot's width and length in one unit, e.g. "3 × 6 m" or "10 × 20 ft". */
export function formatSize(width: number, length: number, units: UnitSystem): string {
  const show = (m: number) => String(roundTo(toDisplayLength(m, units), 2));
  return `${show(width)} × ${show(length)} ${lengthUnitLabel(units)}`;
}

/** Soil depth the way growers say it: centimetres, or inches on US sites (common practice). */
export function formatSoilDepth(metres: number, units: UnitSystem): string {
  return units === 'us' ? `${roundTo(metres / METRES_PER_INCH, 1)} in` : `${roundTo(metres * 100, 0)} cm`;
}

/** Compass words for a neighbour's side: "north" → "To the north". */
export function sideText(side: string): string {
  return ['north', 'south', 'east', 'west'].includes(side) ? `To the ${side}` : side;
}

/**
 * A plot's area, e.g. "18 m²" or "32 ft²". Square feet get one decimal: lengths are stored to the
 * millimetre, so an 8 × 4 ft bed comes back as 31.99 ft², a precision no tape measure gives.
 */
export function formatPlotArea(m2: number, units: UnitSystem): string {
  return formatArea(m2, units, units === 'us' ? 1 : 2);
}
