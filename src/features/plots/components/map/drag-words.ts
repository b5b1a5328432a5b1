import { lengthUnitLabel, toDisplayLength, type UnitSystem } from '@shared/geometry';

/** Splits a map drag id such as "move:14" or "person:3" into its kind and number. */
export function dragIdParts(id: string | number): { kind: string; id: number } {
  const [kind = '', n = ''] = String(id).split(':');
  return { kind, id: Number(n) };
}

/** A length as a screen reader hears it during a drag: one decimal in the site's units ("4.2 m"). */
function spoken(m: number, units: UnitSystem): string {
  return `${toDisplayLength(m, units).toFixed(1)} ${lengthUnitLabel(units)}`;
}

/** "Plot A-3 moved to 4.2 m from the west edge, 1.0 m from the north edge." */
export function movedWords(label: string, x: number, y: number, units: UnitSystem): string {
  return `Plot ${label} moved to ${spoken(x, units)} from the west edge, ${spoken(y, units)} from the north edge.`;
}

/** "Plot A-4 resized to 3.0 × 2.0 m." (width × length) */
export function resizedWords(label: string, width: number, length: number, units: UnitSystem): string {
  const [w, l] = [spoken(width, units), spoken(length, units)];
  return `Plot ${label} resized to ${w.split(' ')[0]} × ${l}.`;
}
