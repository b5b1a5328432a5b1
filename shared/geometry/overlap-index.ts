import { DEFAULT_EPS, footprint, type Bounds, type Rect } from './rect';

/** For one plot of a batch: the earliest plot before it that it overlaps, and how many earlier plots in all. */
export interface FirstOverlap {
  /** Index (in input order) of the earliest earlier plot sharing ground with this one. */
  with: number;
  /** Earlier plots it overlaps, counted up to `countLimit`. */
  count: number;
}

function overlapArea(a: Bounds, b: Bounds, eps: number): boolean {
  return Math.min(a.maxX, b.maxX) - Math.max(a.minX, b.minX) > eps && Math.min(a.maxY, b.maxY) - Math.max(a.minY, b.minY) > eps;
}

/** Middle value of a list of numbers (the list is copied, not changed). */
function median(values: number[]): number {
  const sorted = [...values].sort((p, q) => p - q);
  return sorted[Math.floor(sorted.length / 2)] ?? 1;
}

/**
 * For each plot in input order, the earliest earlier plot it overlaps (or null), using a uniform
 * grid index instead of comparing every pair. A cell is about the size of a typical plot (the
 * median side, and never so small that the largest plot spans more than 32 cells a side), so
 * plots that do not overlap meet only their few neighbours in shared cells: about n·k checks for
 * n plots touching k cells each. Plots piled on one another stop at the first hit in each cell
 * (cells keep insertion order, so that hit is the earliest there) and count further overlaps
 * only up to `countLimit`, so even 2,000 plots on one spot cost about n·countLimit checks, not n².
 */
export function firstOverlaps(plots: ReadonlyArray<Rect>, eps = DEFAULT_EPS, countLimit = 10): Array<FirstOverlap | null> {
  const boxes = plots.map(footprint);
  if (boxes.length === 0) return [];
  const sides = boxes.flatMap((b) => [b.maxX - b.minX, b.maxY - b.minY]);
  const cell = Math.max(median(sides), Math.max(...sides) / 32, 1e-3);
  const grid = new Map<number, number[]>();
  const cellsOf = (b: Bounds) => {
    const keys: number[] = [];
    // Shrink by eps so plots that merely touch on a cell line are not put in the next cell.
    const x0 = Math.floor((b.minX + eps) / cell);
    const x1 = Math.floor((b.maxX - eps) / cell);
    const y0 = Math.floor((b.minY + eps) / cell);
    const y1 = Math.floor((b.maxY - eps) / cell);
    for (let cx = x0; cx <= Math.max(x0, x1); cx++) for (let cy = y0; cy <= Math.max(y0, y1); cy++) keys.push(cx * 1_000_003 + cy);
    return keys;
  };

  const result: Array<FirstOverlap | null> = [];
  for (let i = 0; i < boxes.length; i++) {
    const box = boxes[i];
    const keys = cellsOf(box);
    let earliest = -1;
    const seen: number[] = []; // few: at most countLimit
    for (const key of keys) {
      const members = grid.get(key);
      if (!members) continue;
      for (const j of members) {
        if (seen.length >= countLimit) break;
        if (seen.includes(j) || !overlapArea(box, boxes[j], eps)) continue;
        seen.push(j);
        if (earliest < 0 || j < earliest) earliest = j;
      }
      if (seen.length >= countLimit) break;
    }
    // With the count capped the earliest may lie in a cell not yet read; read the first hit of each remaining cell.
    if (seen.length >= countLimit) {
      for (const key of keys) {
        for (const j of grid.get(key) ?? []) {
          if (j >= earliest) break; // cells hold indices in ascending order
          if (overlapArea(box, boxes[j], eps)) {
            earliest = j;
            break;
          }
        }
      }
    }
    result.push(earliest < 0 ? null : { with: earliest, count: seen.length });
    for (const key of keys) {
      const members = grid.get(key);
      if (members) members.push(i);
      else grid.set(key, [i]);
    }
  }
  return result;
}
