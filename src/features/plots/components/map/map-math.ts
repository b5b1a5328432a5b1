import { footprint, overlaps, snap, type Rect } from '@shared/geometry';
import { feetToMetres, type UnitSystem } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';

/** A round scale-bar length (1, 2 or 5 × 10ⁿ in display units) that is about `targetPx` long on screen. */
export function niceScaleLength(pxPerUnit: number, targetPx = 120): number {
  const raw = targetPx / pxPerUnit;
  const pow = 10 ** Math.floor(Math.log10(raw));
  for (const m of [5, 2, 1]) if (m * pow <= raw) return m * pow;
  return pow;
}

/** Default size of a new plot: 3 × 6 m, or 10 × 20 ft on a US-units site (common sizes; common practice). */
export function defaultPlotSize(units: UnitSystem) {
  return units === 'us' ? { width: feetToMetres(10), length: feetToMetres(20) } : { width: 3, length: 6 };
}

/** The next free label in the style of the existing ones ("P-7" after "P-6"). */
export function nextLabel(plots: Pick<Plot, 'label'>[]): string {
  const taken = new Set(plots.map((p) => p.label.toLowerCase()));
  for (let n = plots.length + 1; n < plots.length + 1000; n++) {
    const label = `P-${n}`;
    if (!taken.has(label.toLowerCase())) return label;
  }
  return `P-${Date.now()}`;
}

/** Scans the site on its grid for the first place a new plot fits without overlapping; null when none. */
export function findFreeSpot(
  site: { width: number; length: number; grid: number; pathWidth: number },
  plots: Rect[],
  size: { width: number; length: number },
): { x: number; y: number } | null {
  const step = Math.max(site.grid || 0.5, 0.5);
  for (let y = 0; y + size.length <= site.length + 1e-9; y += step) {
    for (let x = 0; x + size.width <= site.width + 1e-9; x += step) {
      const rect: Rect = { x: snap(x, step), y: snap(y, step), ...size, rotation: 0 };
      if (!plots.some((p) => overlaps(rect, p))) return { x: rect.x, y: rect.y };
    }
  }
  return null;
}

/** Keeps a footprint inside the site by sliding it back from the edges. */
export function clampToSite(rect: Rect, site: { width: number; length: number }): Rect {
  const fp = footprint(rect);
  const w = fp.maxX - fp.minX;
  const h = fp.maxY - fp.minY;
  return { ...rect, x: Math.min(Math.max(0, rect.x), Math.max(0, site.width - w)), y: Math.min(Math.max(0, rect.y), Math.max(0, site.length - h)) };
}

/** Turns a new on-screen footprint span (east-west, north-south) back into width/length for the plot's rotation. */
export function spansToSize(rotation: 0 | 90, spanX: number, spanY: number) {
  return rotation === 90 ? { width: spanY, length: spanX } : { width: spanX, length: spanY };
}

/** Initials of a name for the map ("Teodor Lind" → "TL"). */
export function initials(name: string): string {
  return name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((w) => w[0]!.toUpperCase())
    .join('');
}
