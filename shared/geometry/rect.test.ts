import { describe, expect, it } from 'vitest';
import type { Feature, LineString, Polygon, Position } from 'geojson';
import { earthRadius, featureCollection, polygon } from '@turf/helpers';
import { area as turfArea } from '@turf/area';
import { intersect } from '@turf/intersect';
import { booleanIntersects } from '@turf/boolean-intersects';
import { booleanDisjoint } from '@turf/boolean-disjoint';
import { pointToLineDistance } from '@turf/point-to-line-distance';
import { polygonToLine } from '@turf/polygon-to-line';
import { distance } from '@turf/distance';
import {
  type Neighbour,
  type PlacedRect,
  type Rotation,
  RectSchema,
  area,
  boundsOf,
  findOverlaps,
  footprint,
  gapBetween,
  neighbourOf,
  neighbours,
  overlaps,
  snap,
} from './rect';

function plot(id: string, x: number, y: number, width: number, length: number, rotation: Rotation = 0) {
  return { id, x, y, width, length, rotation } satisfies PlacedRect<string>;
}

// The hand-made cases below carry their working: every expected value is computed by hand
// from the plots' x, y, width and length (metres; x grows east, y grows south).
describe('footprint and area', () => {
  it('spans width east and length south at rotation 0', () => {
    // computed: minX = x = 1, minY = y = 2, maxX = 1 + 3 = 4, maxY = 2 + 6 = 8
    expect(footprint(plot('a', 1, 2, 3, 6))).toEqual({ minX: 1, minY: 2, maxX: 4, maxY: 8 });
  });

  it('turns a quarter in place at rotation 90, keeping the north-west corner', () => {
    // computed: turned, the length runs east and the width south: maxX = 1 + 6 = 7, maxY = 2 + 3 = 5
    expect(footprint(plot('a', 1, 2, 3, 6, 90))).toEqual({ minX: 1, minY: 2, maxX: 7, maxY: 5 });
  });

  it('cleans float noise off the far edges', () => {
    // computed: 0.1 + 0.2 = 0.3 (binary gives 0.30000000000000004)
    expect(footprint(plot('a', 0.1, 0.1, 0.2, 0.2)).maxX).toBe(0.3);
  });

  it('gives the area in square metres, unchanged by rotation', () => {
    // computed: 3 × 6 = 18 m²; turned it is 6 × 3 = 18 m²; 0.1 × 0.3 = 0.03 m²
    expect(area(plot('a', 0, 0, 3, 6))).toBe(18);
    expect(area(plot('a', 5, 5, 3, 6, 90))).toBe(18);
    expect(area(plot('a', 0, 0, 0.1, 0.3))).toBe(0.03);
  });

  it('validates rectangles with the schema', () => {
    // The schema's rules: rotation is 0 or 90, sizes are positive, numbers are finite.
    expect(RectSchema.safeParse({ x: 0, y: 0, width: 3, length: 6, rotation: 90 }).success).toBe(true);
    expect(RectSchema.safeParse({ x: 0, y: 0, width: 3, length: 6, rotation: 45 }).success).toBe(false);
    expect(RectSchema.safeParse({ x: 0, y: 0, width: 0, length: 6, rotation: 0 }).success).toBe(false);
    expect(RectSchema.safeParse({ x: Infinity, y: 0, width: 3, length: 6, rotation: 0 }).success).toBe(false);
  });
});

describe('overlaps', () => {
  const a = plot('a', 0, 0, 3, 6); // x 0–3, y 0–6

  it('refuses plots that share ground', () => {
    // computed: b spans x 2.9–5.9: shares 3 − 2.9 = 0.1 m × 6 m = 0.6 m²
    // b spans x 1–2, y 1–2: inside a, shares 1 m²
    // b spans x −1–0.5, y 5.5–6.5: shares (0.5 − 0) × (6 − 5.5) = 0.5 × 0.5 = 0.25 m²
    expect(overlaps(a, plot('b', 2.9, 0, 3, 6))).toBe(true);
    expect(overlaps(a, plot('b', 1, 1, 1, 1))).toBe(true);
    expect(overlaps(a, plot('b', -1, 5.5, 1.5, 1))).toBe(true);
  });

  it('allows plots that only touch along an edge or at a corner', () => {
    // computed: b starts at x = 3 where a ends (3 − 3 = 0 shared); b starts at y = 6 where a ends;
    // b's north-west corner is a's south-east corner (3, 6)
    expect(overlaps(a, plot('b', 3, 0, 3, 6))).toBe(false);
    expect(overlaps(a, plot('b', 0, 6, 3, 6))).toBe(false);
    expect(overlaps(a, plot('b', 3, 6, 1, 1))).toBe(false);
    // 0.1 + 0.2 ≠ 0.3 in binary; the edges still only touch.
    // computed: c ends at 0.1 + 0.2 = 0.30000000000000004, d starts at 0.3: 5.6e-17 m apart, within eps
    expect(overlaps(plot('c', 0.1, 0, 0.2, 1), plot('d', 0.3, 0, 1, 1))).toBe(false);
  });

  it('lets rotation decide', () => {
    // computed: b spans x 4–6, y 0–2. a unturned spans x 0–2: 4 − 2 = 2 m apart.
    // a turned spans x 0–5, y 0–2: shares (5 − 4) × 2 = 2 m² with b
    const b = plot('b', 4, 0, 2, 2);
    expect(overlaps(plot('a', 0, 0, 2, 5), b)).toBe(false);
    expect(overlaps(plot('a', 0, 0, 2, 5, 90), b)).toBe(true);
  });

  it('lists each overlapping pair once, in input order', () => {
    // computed: p1 x 10–13 y 0–3; p2 x 0–3 y 0–3; p3 x 2–5 y 2–5; p4 x 3–6 y 1.5–2.5; p5 x 11–12 y 1–2.
    // p1/p5: p5 lies inside p1. p2/p3: x 2–3 and y 2–3 shared (1 m²). p3/p4: x 3–5, y 2–2.5 (1 m²).
    // p2/p4 only touch at x = 3; p1 and p5 are 5 m or more east of p2, p3 and p4.
    const plots = [
      plot('p1', 10, 0, 3, 3),
      plot('p2', 0, 0, 3, 3),
      plot('p3', 2, 2, 3, 3),
      plot('p4', 3, 1.5, 3, 1),
      plot('p5', 11, 1, 1, 1),
    ];
    expect(findOverlaps(plots)).toEqual([
      { a: 'p1', b: 'p5' },
      { a: 'p2', b: 'p3' },
      { a: 'p3', b: 'p4' },
    ]);
  });
});

describe('gapBetween', () => {
  const a = plot('a', 0, 0, 3, 6); // x 0–3, y 0–6
  it('measures straight across a path', () => {
    // computed: 3.6 − 3 = 0.6 m east; 6.9 − 6 = 0.9 m south
    expect(gapBetween(a, plot('b', 3.6, 0, 3, 6))).toBe(0.6);
    expect(gapBetween(a, plot('b', 0, 6.9, 3, 6))).toBe(0.9);
  });
  it('measures corner to corner for diagonal plots', () => {
    // computed: from a's corner (3, 6) to b's (3.3, 6.4): √(0.3² + 0.4²) = √0.25 = 0.5 m
    expect(gapBetween(a, plot('b', 3.3, 6.4, 1, 1))).toBeCloseTo(0.5, 12);
  });
  it('is 0 for touching or overlapping plots', () => {
    // computed: b starts at x = 3 on a's east edge; b's corner is a's corner (3, 6); b (x 1–6, y 1–6) overlaps a
    expect(gapBetween(a, plot('b', 3, 2, 1, 1))).toBe(0);
    expect(gapBetween(a, plot('b', 3, 6, 1, 1))).toBe(0);
    expect(gapBetween(a, plot('b', 1, 1, 5, 5))).toBe(0);
  });
});

describe('neighbours', () => {
  const a = plot('a', 0, 0, 3, 6); // x 0–3, y 0–6

  it('finds plots touching side by side', () => {
    // computed: b spans x 3–6, so gap 3 − 3 = 0, east of a; both span y 0–6: facing 6 m
    expect(neighbours([a, plot('b', 3, 0, 3, 6)], 0.9)).toEqual([
      { a: 'a', b: 'b', kind: 'touching', gap: 0, side: 'east', facing: 6 },
    ]);
  });

  it('finds plots across a 0.6 m path when paths are up to 0.9 m', () => {
    // computed: gap 3.6 − 3 = 0.6 m ≤ 0.9 m, east; both span y 0–6: facing 6 m
    expect(neighbours([a, plot('b', 3.6, 0, 3, 6)], 0.9)).toEqual([
      { a: 'a', b: 'b', kind: 'across_path', gap: 0.6, side: 'east', facing: 6 },
    ]);
  });

  it('counts a gap of exactly the path width, float noise and all', () => {
    // computed: n ends at 0.1 + 0.2 = 0.3, f starts at 1.2: gap 1.2 − 0.3 = 0.9 m (binary gives
    // 0.8999999999999999), which is the path width; both span y 0–1: facing 1 m
    const near = plot('n', 0.1, 0, 0.2, 1);
    const far = plot('f', 1.2, 0, 1, 1);
    expect(neighbours([near, far], 0.9)).toEqual([
      { a: 'n', b: 'f', kind: 'across_path', gap: 0.9, side: 'east', facing: 1 },
    ]);
  });

  it('ignores plots 1.2 m apart when paths are up to 0.9 m', () => {
    // computed: 4.2 − 3 = 1.2 m east and 7.2 − 6 = 1.2 m south, both over 0.9 m
    expect(neighbours([a, plot('b', 4.2, 0, 3, 6)], 0.9)).toEqual([]);
    expect(neighbours([a, plot('b', 0, 7.2, 3, 6)], 0.9)).toEqual([]);
  });

  it('ignores plots that meet only at a corner', () => {
    // computed: b (x 3–6, y 6–12) meets a only at (3, 6); b (x −3–0, y −6–0) only at (0, 0):
    // no stretch of edge faces the other plot
    expect(neighbours([a, plot('b', 3, 6, 3, 6)], 0.9)).toEqual([]);
    expect(neighbours([a, plot('b', -3, -6, 3, 6)], 0.9)).toEqual([]);
  });

  it('ignores diagonal plots even when the corner gap is under the path width', () => {
    // computed: corner gap √(0.3² + 0.4²) = 0.5 m < 0.9 m, but b (x 3.3–6.3, y 6.4–12.4) shares
    // neither a's x span nor its y span
    const b = plot('b', 3.3, 6.4, 3, 6);
    expect(gapBetween(a, b)).toBeLessThan(0.9);
    expect(neighbours([a, b], 0.9)).toEqual([]);
  });

  it('needs the facing stretch to be longer than the tolerance', () => {
    // computed: b at y = 6 − 1e-7 faces a for only 6 − (6 − 1e-7) = 1e-7 m, within the tolerance.
    // b at y = 5.9 faces a for 6 − 5.9 = 0.1 m, across a gap of 3.5 − 3 = 0.5 m, east
    expect(neighbours([a, plot('b', 3.5, 6 - 1e-7, 3, 6)], 0.9)).toEqual([]);
    expect(neighbours([a, plot('b', 3.5, 5.9, 3, 6)], 0.9)).toEqual([
      { a: 'a', b: 'b', kind: 'across_path', gap: 0.5, side: 'east', facing: 0.1 },
    ]);
  });

  it('does not report overlapping plots', () => {
    // computed: b spans x 2–5, sharing x 2–3 (1 m × 6 m) with a
    expect(neighbours([a, plot('b', 2, 0, 3, 6)], 0.9)).toEqual([]);
  });

  it('lets rotation 90 change the answer', () => {
    // computed: b spans x 5.5–8.5, y 0–3. a unturned spans x 0–2: gap 5.5 − 2 = 3.5 m, too far.
    // a turned spans x 0–5, y 0–2: gap 5.5 − 5 = 0.5 m, east; shared y 0–2: facing 2 m
    const b = plot('b', 5.5, 0, 3, 3);
    expect(neighbours([plot('a', 0, 0, 2, 5), b], 0.9)).toEqual([]);
    expect(neighbours([plot('a', 0, 0, 2, 5, 90), b], 0.9)).toEqual([
      { a: 'a', b: 'b', kind: 'across_path', gap: 0.5, side: 'east', facing: 2 },
    ]);
  });

  it('names the side where b lies as seen from a (north up, y grows south)', () => {
    // computed: the centre spans x 10–12, y 10–12; each outer plot is 0.5 m off one side
    // (n ends at y 9.5, s starts at 12.5, e starts at x 12.5, w ends at 9.5); outer plots are
    // 3 m apart or diagonal to each other, so only the four pairs with the centre count
    const centre = plot('c', 10, 10, 2, 2);
    const around = [
      plot('n', 10, 7.5, 2, 2),
      plot('s', 10, 12.5, 2, 2),
      plot('e', 12.5, 10, 2, 2),
      plot('w', 7.5, 10, 2, 2),
    ];
    const found = neighbours([centre, ...around], 0.9);
    expect(found.map((n) => [n.a, n.b, n.side])).toEqual([
      ['c', 'n', 'north'],
      ['c', 's', 'south'],
      ['c', 'e', 'east'],
      ['c', 'w', 'west'],
    ]);
    // With the centre listed last, a is the outer plot and the side flips.
    const flipped = neighbours([...around, centre], 0.9);
    expect(flipped.map((n) => [n.a, n.b, n.side])).toEqual([
      ['n', 'c', 'south'],
      ['s', 'c', 'north'],
      ['e', 'c', 'west'],
      ['w', 'c', 'east'],
    ]);
  });

  it('gives the facing length of partly offset plots', () => {
    // computed: b spans x 1–6, y 6.3–8.3: south of a, gap 6.3 − 6 = 0.3 m, facing x 1–3 = 2 m
    const [n] = neighbours([a, plot('b', 1, 6.3, 5, 2)], 0.9);
    expect(n).toMatchObject({ side: 'south', gap: 0.3, facing: 2 });
  });

  it('reports touching when pathWidth is 0 and nothing else', () => {
    // computed: b touches a's east edge (gap 0); c is 6.3 − 6 = 0.3 m south, more than a 0 m path
    const plots = [a, plot('b', 3, 0, 3, 6), plot('c', 0, 6.3, 3, 6)];
    expect(neighbours(plots, 0).map((n) => [n.a, n.b, n.kind])).toEqual([['a', 'b', 'touching']]);
  });

  it('works with numeric ids and reports each pair once', () => {
    // computed: 7 spans x 0–1, 3 spans x 1–2: touching, east; both span y 0–1: facing 1 m
    const plots = [
      { id: 7, x: 0, y: 0, width: 1, length: 1, rotation: 0 as const },
      { id: 3, x: 1, y: 0, width: 1, length: 1, rotation: 0 as const },
    ];
    expect(neighbours(plots, 0.5)).toEqual([
      { a: 7, b: 3, kind: 'touching', gap: 0, side: 'east', facing: 1 },
    ]);
  });

  it('rejects a negative or non-finite path width', () => {
    expect(() => neighbours([a], -0.1)).toThrow(RangeError);
    expect(() => neighbourOf(a, a, Number.NaN)).toThrow(RangeError);
  });
});

describe('snap', () => {
  it('rounds to the nearest grid multiple without float noise', () => {
    // computed: 0.30000000000000004 / 0.1 ≈ 3 → 0.3; 1.26 / 0.25 = 5.04 → 5 × 0.25 = 1.25;
    // 1.04 / 0.1 = 10.4 → 10 × 0.1 = 1; 0.7 / 0.1 = 7 (binary 6.999999999999999) → 0.7;
    // 12.345 / 0.5 = 24.69 → 25 × 0.5 = 12.5; −0.34 / 0.1 = −3.4 → −3 × 0.1 = −0.3
    expect(snap(0.1 + 0.2, 0.1)).toBe(0.3);
    expect(snap(1.26, 0.25)).toBe(1.25);
    expect(snap(1.04, 0.1)).toBe(1);
    expect(snap(0.7, 0.1)).toBe(0.7);
    expect(snap(12.345, 0.5)).toBe(12.5);
    expect(snap(-0.34, 0.1)).toBe(-0.3);
  });
  it('never returns negative zero', () => {
    // computed: −0.04 / 0.1 = −0.4 → rounds to −0, which must come back as 0
    expect(Object.is(snap(-0.04, 0.1), 0)).toBe(true);
  });
  it('leaves values alone with grid 0', () => {
    expect(snap(1.2345, 0)).toBe(1.2345);
  });
});

describe('boundsOf', () => {
  it('is null for no plots', () => {
    expect(boundsOf([])).toBeNull();
  });
  it('covers every footprint, rotation included', () => {
    // computed: a spans x 1–4, y 2–8; b turned spans x −1 to −1 + 10 = 9, y 5 to 5 + 2 = 7:
    // minX = −1 (b), minY = 2 (a), maxX = 9 (b), maxY = 8 (a)
    expect(boundsOf([plot('a', 1, 2, 3, 6), plot('b', -1, 5, 2, 10, 90)])).toEqual({
      minX: -1,
      minY: 2,
      maxX: 9,
      maxY: 8,
    });
  });
});

// A garden laid out in rows: 25 × 20 beds of 3 × 3 m with 0.6 m paths
// between beds and 0.9 m paths between rows; every fifth bed is a 3 × 1.5 m
// bed turned a quarter, which leaves a wider path on its east side.
function gardenOf500(): PlacedRect<number>[] {
  const beds: PlacedRect<number>[] = [];
  for (let row = 0; row < 20; row++) {
    for (let col = 0; col < 25; col++) {
      const id = row * 25 + col;
      const turned = id % 5 === 0;
      beds.push({ id, x: col * 3.6, y: row * 3.9, width: 3, length: turned ? 1.5 : 3, rotation: turned ? 90 : 0 });
    }
  }
  return beds;
}

describe('neighbours on 500 plots', () => {
  it('agrees with the all-pairs check', () => {
    const beds = gardenOf500();
    const brute: Neighbour<number>[] = [];
    for (let i = 0; i < beds.length; i++) {
      for (let j = i + 1; j < beds.length; j++) {
        const rel = neighbourOf(beds[i], beds[j], 0.9);
        if (rel) brute.push({ a: beds[i].id, b: beds[j].id, ...rel });
      }
    }
    const swept = neighbours(beds, 0.9);
    expect(swept.length).toBeGreaterThan(500);
    expect(swept).toEqual(brute);
  });

  it('stays well under 50 ms', () => {
    const beds = gardenOf500();
    neighbours(beds, 0.9);
    const times: number[] = [];
    for (let run = 0; run < 7; run++) {
      const start = performance.now();
      neighbours(beds, 0.9);
      times.push(performance.now() - start);
    }
    times.sort((p, q) => p - q);
    expect(times[3]).toBeLessThan(50);
  });
});

// Property test against turf. Each layout is drawn on a 0.1 m grid so that
// exact touching, corner contact and gaps equal to the path width happen
// often. Coordinates are kept as whole decimetres for turf and divided by 10
// for our code, so our side also meets the float noise of 0.1 + 0.2.
//
// Turf works on a sphere in degrees. We map 1 m to 1e-5° near (0°, 0°)
// (x → longitude, y → minus latitude, so north stays up). Over a 20 m field
// that is at most 2e-4° from the origin: the sphere-versus-plane difference
// there is of order (3.5e-6 rad)² ≈ 1e-11 relative, and measured turf
// discrepancies are below 1e-9 m. We therefore accept 1e-6 m (the same as
// our eps) on distances. Because every true length on a 0.1 m grid is a
// multiple of 0.1 m, any tolerance between turf's noise and 0.05 m gives the
// same verdicts; 1e-6 m sits comfortably inside that window.

const DEG_PER_DM = 1e-6;
const DEG_PER_M = 1e-5;
const TOL_M = 1e-6;
// Turf's area is in square metres on a sphere of radius earthRadius; one map
// metre is earthRadius × (1e-5° in radians) of those metres.
const TURF_M_PER_MAP_M = (earthRadius * Math.PI * DEG_PER_M) / 180;
// Real overlaps on a 0.1 m grid are at least 0.1 × 0.1 = 0.01 m²; an
// intersection smaller than 1e-4 m² can only be a degenerate sliver from
// touching edges.
const MIN_OVERLAP_M2 = 1e-4;

function mulberry32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface GridPlot {
  id: string;
  xd: number;
  yd: number;
  wd: number;
  ld: number;
  rotation: Rotation;
}

/** Independent of footprint(): the east-west and north-south spans in decimetres. */
function spansDm(p: GridPlot): { sx: number; sy: number } {
  return p.rotation === 90 ? { sx: p.ld, sy: p.wd } : { sx: p.wd, sy: p.ld };
}

function toRect(p: GridPlot): PlacedRect<string> {
  return { id: p.id, x: p.xd / 10, y: p.yd / 10, width: p.wd / 10, length: p.ld / 10, rotation: p.rotation };
}

function makeLayout(rand: () => number): { plots: GridPlot[]; pathDm: number } {
  const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));
  const pick = <T,>(items: readonly T[]) => items[Math.floor(rand() * items.length)];
  const count = int(4, 12);
  const plots: GridPlot[] = [];
  for (let k = 0; k < count; k++) {
    const wd = int(3, 40);
    const ld = int(3, 40);
    const rotation: Rotation = rand() < 0.5 ? 0 : 90;
    const p: GridPlot = { id: `p${k}`, xd: int(0, 150), yd: int(0, 150), wd, ld, rotation };
    const prev = plots.length > 0 && rand() < 0.6 ? pick(plots) : null;
    if (prev) {
      // Put the new plot next to an earlier one: touching, across a path,
      // at its corner, or diagonally off it.
      const q = spansDm(prev);
      const s = spansDm(p);
      const gap = pick([0, 0, 0, 3, 6, 9, 9, 12, int(1, 15)]);
      const along = pick(['x', 'y'] as const);
      const mode = pick(['side', 'side', 'side', 'corner', 'diagonal'] as const);
      const slideX = mode === 'side' ? int(-s.sx + 1, q.sx - 1) : pick([-s.sx, q.sx]);
      const slideY = mode === 'side' ? int(-s.sy + 1, q.sy - 1) : pick([-s.sy, q.sy]);
      const off = mode === 'diagonal' ? int(1, 8) : 0;
      if (along === 'x') {
        p.xd = rand() < 0.5 ? prev.xd + q.sx + gap : prev.xd - s.sx - gap;
        p.yd = prev.yd + slideY + (slideY < 0 ? -off : slideY >= q.sy ? off : 0);
      } else {
        p.yd = rand() < 0.5 ? prev.yd + q.sy + gap : prev.yd - s.sy - gap;
        p.xd = prev.xd + slideX + (slideX < 0 ? -off : slideX >= q.sx ? off : 0);
      }
    }
    plots.push(p);
  }
  return { plots, pathDm: pick([0, 3, 6, 9, 9, 12, int(0, 15)]) };
}

function turfPolygon(p: GridPlot): Feature<Polygon> {
  const { sx, sy } = spansDm(p);
  const west = p.xd * DEG_PER_DM;
  const east = (p.xd + sx) * DEG_PER_DM;
  const north = -p.yd * DEG_PER_DM;
  const south = -(p.yd + sy) * DEG_PER_DM;
  return polygon([
    [
      [west, south],
      [east, south],
      [east, north],
      [west, north],
      [west, south],
    ],
  ]);
}

function ringOf(poly: Feature<Polygon>): Position[] {
  return poly.geometry.coordinates[0];
}

/** (a) turf's verdict: the intersection polygon has positive area. */
function turfOverlaps(pa: Feature<Polygon>, pb: Feature<Polygon>): boolean {
  const shared = intersect(featureCollection([pa, pb]));
  if (!shared) return false;
  return turfArea(shared) / TURF_M_PER_MAP_M ** 2 > MIN_OVERLAP_M2;
}

/** (b) turf's shortest distance in map metres: 0 if the shapes meet, else the nearest vertex-to-edge distance. */
function turfGap(pa: Feature<Polygon>, pb: Feature<Polygon>): number {
  if (booleanIntersects(pa, pb)) return 0;
  // For two disjoint convex polygons the shortest distance runs from a
  // vertex of one to an edge of the other.
  let best = Infinity;
  for (const [from, to] of [
    [pa, pb],
    [pb, pa],
  ]) {
    const outline = polygonToLine(to) as Feature<LineString>;
    for (const v of ringOf(from)) {
      best = Math.min(best, pointToLineDistance(v, outline, { units: 'degrees' }));
    }
  }
  return best / DEG_PER_M;
}

interface Box {
  west: number;
  east: number;
  north: number;
  south: number;
}

function boxOf(poly: Feature<Polygon>): Box {
  const lons = ringOf(poly).map((c) => c[0]);
  const lats = ringOf(poly).map((c) => c[1]);
  return { west: Math.min(...lons), east: Math.max(...lons), north: Math.max(...lats), south: Math.min(...lats) };
}

/** (c) the brute-force oracle: every pair, from turf's overlap and gap plus the facing condition. */
function turfNeighbours(plots: GridPlot[], pathWidth: number): Neighbour<string>[] {
  const polys = plots.map(turfPolygon);
  const boxes = polys.map(boxOf);
  const tolDeg = TOL_M * DEG_PER_M;
  const out: Neighbour<string>[] = [];
  for (let i = 0; i < plots.length; i++) {
    for (let j = i + 1; j < plots.length; j++) {
      if (turfOverlaps(polys[i], polys[j])) continue;
      const A = boxes[i];
      const B = boxes[j];
      const lonStart = Math.max(A.west, B.west);
      const lonEnd = Math.min(A.east, B.east);
      const latTop = Math.min(A.north, B.north);
      const latBottom = Math.max(A.south, B.south);
      let side: Neighbour['side'];
      let facing: number;
      if (lonEnd - lonStart > tolDeg) {
        side = B.north <= A.south + tolDeg ? 'south' : 'north';
        facing = distance([lonStart, A.north], [lonEnd, A.north], { units: 'degrees' }) / DEG_PER_M;
      } else if (latTop - latBottom > tolDeg) {
        side = B.west >= A.east - tolDeg ? 'east' : 'west';
        facing = distance([A.west, latBottom], [A.west, latTop], { units: 'degrees' }) / DEG_PER_M;
      } else {
        continue;
      }
      const gap = turfGap(polys[i], polys[j]);
      if (gap > pathWidth + TOL_M) continue;
      const touching = gap <= TOL_M;
      out.push({
        a: plots[i].id,
        b: plots[j].id,
        kind: touching ? 'touching' : 'across_path',
        gap: touching ? 0 : gap,
        side,
        facing,
      });
    }
  }
  return out;
}

describe('agreement with turf on random layouts', () => {
  const LAYOUTS = 250;
  const rand = mulberry32(20240611);
  const layouts = Array.from({ length: LAYOUTS }, () => makeLayout(rand));

  it('overlaps() and findOverlaps() agree with turf intersect + area', () => {
    let overlapping = 0;
    let touchingOnly = 0;
    for (const { plots } of layouts) {
      const rects = plots.map(toRect);
      const polys = plots.map(turfPolygon);
      const expected: Array<{ a: string; b: string }> = [];
      for (let i = 0; i < plots.length; i++) {
        for (let j = i + 1; j < plots.length; j++) {
          const truth = turfOverlaps(polys[i], polys[j]);
          expect(overlaps(rects[i], rects[j]), `${JSON.stringify([plots[i], plots[j]])}`).toBe(truth);
          if (truth) {
            overlapping++;
            expected.push({ a: plots[i].id, b: plots[j].id });
            expect(booleanIntersects(polys[i], polys[j])).toBe(true);
          } else if (booleanIntersects(polys[i], polys[j])) {
            touchingOnly++;
          }
        }
      }
      expect(findOverlaps(rects)).toEqual(expected);
    }
    // The generator must really produce both cases, or this proves little.
    expect(overlapping).toBeGreaterThan(100);
    expect(touchingOnly).toBeGreaterThan(100);
  });

  it('gapBetween() agrees with turf point-to-line distances', () => {
    let zero = 0;
    let positive = 0;
    for (const { plots } of layouts) {
      const rects = plots.map(toRect);
      const polys = plots.map(turfPolygon);
      for (let i = 0; i < plots.length; i++) {
        for (let j = i + 1; j < plots.length; j++) {
          const ours = gapBetween(rects[i], rects[j]);
          const theirs = turfGap(polys[i], polys[j]);
          expect(Math.abs(ours - theirs), `${JSON.stringify([plots[i], plots[j]])}`).toBeLessThanOrEqual(TOL_M);
          expect(booleanDisjoint(polys[i], polys[j])).toBe(ours > TOL_M);
          if (ours === 0) zero++;
          else positive++;
        }
      }
    }
    expect(zero).toBeGreaterThan(100);
    expect(positive).toBeGreaterThan(1000);
  });

  it('neighbours() agrees with the brute-force turf oracle', () => {
    const seen = { touching: 0, across_path: 0, atPathWidth: 0, cornerOnly: 0, diagonalWithinPath: 0 };
    for (const { plots, pathDm } of layouts) {
      const pathWidth = pathDm / 10;
      const ours = neighbours(plots.map(toRect), pathWidth);
      const oracle = turfNeighbours(plots, pathWidth);
      const context = JSON.stringify({ plots, pathWidth });
      expect(ours.map((n) => [n.a, n.b, n.kind, n.side]), context).toEqual(
        oracle.map((n) => [n.a, n.b, n.kind, n.side]),
      );
      ours.forEach((n, k) => {
        expect(Math.abs(n.gap - oracle[k].gap), context).toBeLessThanOrEqual(TOL_M);
        expect(Math.abs(n.facing - oracle[k].facing), context).toBeLessThanOrEqual(TOL_M);
        seen[n.kind]++;
        if (n.kind === 'across_path' && Math.abs(n.gap - pathWidth) <= TOL_M) seen.atPathWidth++;
      });
      // Count the contacts that must be turned down, straight from the grid integers.
      for (let i = 0; i < plots.length; i++) {
        for (let j = i + 1; j < plots.length; j++) {
          const a = plots[i];
          const b = plots[j];
          const sa = spansDm(a);
          const sb = spansDm(b);
          const ox = Math.min(a.xd + sa.sx, b.xd + sb.sx) - Math.max(a.xd, b.xd);
          const oy = Math.min(a.yd + sa.sy, b.yd + sb.sy) - Math.max(a.yd, b.yd);
          if (ox === 0 && oy === 0) seen.cornerOnly++;
          if (ox < 0 && oy < 0 && Math.hypot(ox, oy) <= pathDm) seen.diagonalWithinPath++;
        }
      }
    }
    expect(seen.touching).toBeGreaterThan(100);
    expect(seen.across_path).toBeGreaterThan(100);
    expect(seen.atPathWidth).toBeGreaterThan(20);
    expect(seen.cornerOnly).toBeGreaterThan(20);
    expect(seen.diagonalWithinPath).toBeGreaterThan(20);
  });
});
