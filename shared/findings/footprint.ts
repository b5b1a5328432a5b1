import { footprint, type Bounds, type Rect } from '../geometry';
import type { PartRect } from './types';

const EPS = 1e-6;

/**
 * Where a planting lies on the site map. A part is measured from the plot's own north-west corner
 * along its width (x) and length (y); a plot turned a quarter (rotation 90) runs its length east-west,
 * so the part turns with it: its width runs north-south and its length east-west.
 */
export function plantingFootprint(plot: Rect, part: PartRect | null): Bounds {
  const box = footprint(plot);
  if (!part) return box;
  if (plot.rotation === 90) {
    return { minX: box.minX + part.y, minY: box.minY + part.x, maxX: box.minX + part.y + part.length, maxY: box.minY + part.x + part.width };
  }
  return { minX: box.minX + part.x, minY: box.minY + part.y, maxX: box.minX + part.x + part.width, maxY: box.minY + part.y + part.length };
}

/** True when two parts of the same plot share ground (a null part is the whole plot); edges that touch do not. */
export function partsOverlap(a: PartRect | null, b: PartRect | null): boolean {
  if (!a || !b) return true;
  const x = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const y = Math.min(a.y + a.length, b.y + b.length) - Math.max(a.y, b.y);
  return x > EPS && y > EPS;
}

/** Shortest distance in metres between two boxes; 0 when they touch or overlap. */
export function boxGap(a: Bounds, b: Bounds): number {
  const dx = Math.max(0, Math.max(a.minX, b.minX) - Math.min(a.maxX, b.maxX));
  const dy = Math.max(0, Math.max(a.minY, b.minY) - Math.min(a.maxY, b.maxY));
  return Math.round(Math.hypot(dx, dy) * 1e6) / 1e6;
}

/** Metres the two boxes share along the east-west axis (negative when they do not). */
export function eastWestOverlap(a: Bounds, b: Bounds): number {
  return Math.min(a.maxX, b.maxX) - Math.max(a.minX, b.minX);
}
