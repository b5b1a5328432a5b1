import { z } from 'zod';

// Site map coordinates are metres with x growing east and y growing south,
// so north is up on screen. A plot is an axis-aligned rectangle anchored at
// its north-west corner; rotation 90 swaps which side runs east-west.

/** A quarter turn in place keeps the north-west corner; nothing else is allowed. */
export type Rotation = 0 | 90;

/** A plot's placement on the site map, in metres. */
export interface Rect {
  x: number;
  y: number;
  width: number;
  length: number;
  rotation: Rotation;
}

/** An axis-aligned box in map metres. */
export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export type PlotId = string | number;

/** A rectangle that carries the id of the plot it belongs to. */
export type PlacedRect<Id extends PlotId = PlotId> = { id: Id } & Rect;

/** Compass side, as seen on the map (north up). */
export type Side = 'north' | 'south' | 'east' | 'west';

export type NeighbourKind = 'touching' | 'across_path';

/** How plot b sits next to plot a. */
export interface NeighbourRelation {
  kind: NeighbourKind;
  /** Metres of path between the facing edges; 0 when touching. */
  gap: number;
  /** Where b lies as seen from a. */
  side: Side;
  /** Length in metres of the stretch where the two edges face each other. */
  facing: number;
}

export interface Neighbour<Id extends PlotId = PlotId> extends NeighbourRelation {
  a: Id;
  b: Id;
}

export interface OverlapPair<Id extends PlotId = PlotId> {
  a: Id;
  b: Id;
}

/** Default tolerance in metres: a micrometre, far below any garden measurement yet far above float noise. */
export const DEFAULT_EPS = 1e-6;

/** Accepts only the two rotations a plot can have. */
export const RotationSchema = z.union([z.literal(0), z.literal(90)]);

/** Checks a plot's placement from outside (request bodies, imports): finite numbers, positive sides. */
export const RectSchema = z.object({
  x: z.number(),
  y: z.number(),
  width: z.number().positive(),
  length: z.number().positive(),
  rotation: RotationSchema,
});

/** Rounds to the nanometre (or nano-square-metre) so 0.1 + 0.2 comes out as 0.3 and noise-sized gaps as 0. */
function cleanMetres(value: number): number {
  return Math.round(value * 1e9) / 1e9 || 0;
}

/** The ground a plot covers on the map, after its rotation. */
export function footprint(plot: Rect): Bounds {
  const spanX = plot.rotation === 90 ? plot.length : plot.width;
  const spanY = plot.rotation === 90 ? plot.width : plot.length;
  return {
    minX: plot.x,
    minY: plot.y,
    maxX: cleanMetres(plot.x + spanX),
    maxY: cleanMetres(plot.y + spanY),
  };
}

/** Growing area of a plot in square metres (rotation does not change it). */
export function area(plot: Rect): number {
  return cleanMetres(plot.width * plot.length);
}

function overlapLengths(a: Bounds, b: Bounds): { x: number; y: number } {
  return {
    x: Math.min(a.maxX, b.maxX) - Math.max(a.minX, b.minX),
    y: Math.min(a.maxY, b.maxY) - Math.max(a.minY, b.minY),
  };
}

function boundsOverlap(a: Bounds, b: Bounds, eps: number): boolean {
  const o = overlapLengths(a, b);
  return o.x > eps && o.y > eps;
}

function checkTolerance(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new RangeError(`${name} must be a finite number ≥ 0, got ${value}`);
  }
}

/** True when two plots share ground of positive area; edges or corners that merely touch do not count. */
export function overlaps(a: Rect, b: Rect, eps = DEFAULT_EPS): boolean {
  return boundsOverlap(footprint(a), footprint(b), eps);
}

/** Indices sorted by the west edge of their footprint, for sweeping west to east. */
function sweepOrder(boxes: readonly Bounds[]): number[] {
  return boxes.map((_, i) => i).sort((i, j) => boxes[i].minX - boxes[j].minX || i - j);
}

function byInputOrder<T extends { ia: number; ib: number }>(p: T, q: T): number {
  return p.ia - q.ia || p.ib - q.ib;
}

/** Every pair of plots that share ground, each pair once with a before b in input order. */
export function findOverlaps<Id extends PlotId>(
  plots: ReadonlyArray<PlacedRect<Id>>,
  eps = DEFAULT_EPS,
): OverlapPair<Id>[] {
  checkTolerance('eps', eps);
  const boxes = plots.map(footprint);
  const order = sweepOrder(boxes);
  const found: Array<{ ia: number; ib: number }> = [];
  for (let s = 0; s < order.length; s++) {
    const i = order[s];
    const a = boxes[i];
    for (let t = s + 1; t < order.length; t++) {
      const j = order[t];
      const b = boxes[j];
      // Later boxes start even further east, so none of them can reach into a.
      if (b.minX >= a.maxX - eps) break;
      if (boundsOverlap(a, b, eps)) found.push({ ia: Math.min(i, j), ib: Math.max(i, j) });
    }
  }
  return found.sort(byInputOrder).map(({ ia, ib }) => ({ a: plots[ia].id, b: plots[ib].id }));
}

/** Shortest distance in metres between two plots' footprints; 0 when they touch or overlap. */
export function gapBetween(a: Rect, b: Rect): number {
  const o = overlapLengths(footprint(a), footprint(b));
  return cleanMetres(Math.hypot(Math.max(0, -o.x), Math.max(0, -o.y)));
}

function relate(a: Bounds, b: Bounds, pathWidth: number, eps: number): NeighbourRelation | null {
  const o = overlapLengths(a, b);
  if (o.x > eps && o.y > eps) return null;
  let side: Side;
  let gap: number;
  let facing: number;
  if (o.x > eps) {
    // They share a stretch east-west, so they face each other across a north or south edge.
    gap = Math.max(0, -o.y);
    side = b.minY - a.maxY >= a.minY - b.maxY ? 'south' : 'north';
    facing = o.x;
  } else if (o.y > eps) {
    gap = Math.max(0, -o.x);
    side = b.minX - a.maxX >= a.minX - b.maxX ? 'east' : 'west';
    facing = o.y;
  } else {
    // Corner-to-corner or diagonal: no edge faces another edge.
    return null;
  }
  if (gap > pathWidth + eps) return null;
  const touching = gap <= eps;
  return {
    kind: touching ? 'touching' : 'across_path',
    gap: touching ? 0 : cleanMetres(gap),
    side,
    facing: cleanMetres(facing),
  };
}

/** How b sits next to a (touching or across a path no wider than pathWidth), or null when they are not neighbours. */
export function neighbourOf(
  a: Rect,
  b: Rect,
  pathWidth: number,
  eps = DEFAULT_EPS,
): NeighbourRelation | null {
  checkTolerance('pathWidth', pathWidth);
  checkTolerance('eps', eps);
  return relate(footprint(a), footprint(b), pathWidth, eps);
}

/**
 * Every pair of plots whose edges face each other, touching or across a path
 * no wider than pathWidth, each pair once with a before b in input order.
 */
export function neighbours<Id extends PlotId>(
  plots: ReadonlyArray<PlacedRect<Id>>,
  pathWidth: number,
  eps = DEFAULT_EPS,
): Neighbour<Id>[] {
  checkTolerance('pathWidth', pathWidth);
  checkTolerance('eps', eps);
  const boxes = plots.map(footprint);
  const order = sweepOrder(boxes);
  const reach = pathWidth + eps;
  const found: Array<{ ia: number; ib: number; rel: NeighbourRelation }> = [];
  for (let s = 0; s < order.length; s++) {
    const i = order[s];
    const a = boxes[i];
    for (let t = s + 1; t < order.length; t++) {
      const j = order[t];
      const b = boxes[j];
      // Later boxes start even further east: too far across any path from a.
      if (b.minX - a.maxX > reach) break;
      if (b.minY - a.maxY > reach || a.minY - b.maxY > reach) continue;
      // Report from the plot that came first in the input, so a < b by input order.
      const [ia, ib] = i < j ? [i, j] : [j, i];
      const rel = relate(boxes[ia], boxes[ib], pathWidth, eps);
      if (rel) found.push({ ia, ib, rel });
    }
  }
  return found
    .sort(byInputOrder)
    .map(({ ia, ib, rel }) => ({ a: plots[ia].id, b: plots[ib].id, ...rel }));
}

/** Rounds a value to the nearest multiple of grid (grid ≤ 0 means no snapping), free of float noise. */
export function snap(value: number, grid: number): number {
  if (!(grid > 0) || !Number.isFinite(value)) return value;
  const snapped = Math.round(value / grid) * grid;
  // k × grid carries at most a couple of ulps of error, so fifteen
  // significant digits give back the decimal the person meant (0.3, not 0.30000000000000004).
  return Number(snapped.toPrecision(15)) || 0;
}

/** The smallest box holding every plot, for fitting the map view; null when there are none. */
export function boundsOf(plots: ReadonlyArray<Rect>): Bounds | null {
  if (plots.length === 0) return null;
  const out = footprint(plots[0]);
  for (const plot of plots) {
    const b = footprint(plot);
    if (b.minX < out.minX) out.minX = b.minX;
    if (b.minY < out.minY) out.minY = b.minY;
    if (b.maxX > out.maxX) out.maxX = b.maxX;
    if (b.maxY > out.maxY) out.maxY = b.maxY;
  }
  return out;
}
