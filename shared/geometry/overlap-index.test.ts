import { describe, expect, it } from 'vitest';
import { firstOverlaps } from './overlap-index';
import { overlaps, type Rect } from './rect';

// Expected values are computed by brute force: every earlier plot compared with `overlaps`.
function bruteForce(plots: Rect[], countLimit: number) {
  return plots.map((p, i) => {
    const hits = plots.slice(0, i).flatMap((q, j) => (overlaps(p, q) ? [j] : []));
    return hits.length === 0 ? null : { with: hits[0], count: Math.min(hits.length, countLimit) };
  });
}

// A small deterministic generator (mulberry32) so failures can be replayed.
function random(seed: number) {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('firstOverlaps (grid index)', () => {
  it('agrees with comparing every pair on 200 random layouts', () => {
    for (let seed = 1; seed <= 200; seed++) {
      const r = random(seed);
      const plots: Rect[] = Array.from({ length: 40 }, () => ({
        x: Math.round(r() * 300) / 10,
        y: Math.round(r() * 300) / 10,
        width: 0.5 + Math.round(r() * 60) / 10,
        length: 0.5 + Math.round(r() * 60) / 10,
        rotation: r() < 0.5 ? 0 : 90,
      }));
      expect(firstOverlaps(plots, undefined, 5), `seed ${seed}`).toEqual(bruteForce(plots, 5));
    }
  });

  it('does not count plots that only touch, across cell lines too', () => {
    // Computed: a 3 m plot at x = 0 ends at x = 3 where the next begins: shared edge, zero area.
    const row: Rect[] = Array.from({ length: 10 }, (_, i) => ({ x: i * 3, y: 0, width: 3, length: 6, rotation: 0 }));
    expect(firstOverlaps(row)).toEqual(Array(10).fill(null));
  });

  it('names the earliest plot for 2,000 plots on one spot and caps the count', () => {
    const pile: Rect[] = Array.from({ length: 2000 }, () => ({ x: 1, y: 1, width: 3, length: 6, rotation: 0 }));
    const found = firstOverlaps(pile, undefined, 10);
    expect(found[0]).toBeNull();
    expect(found[1]).toEqual({ with: 0, count: 1 });
    expect(found[1999]).toEqual({ with: 0, count: 10 });
  });

  it('finds the earliest overlap even when the count cap is reached in a later cell', () => {
    // Computed: plot 0 is a 10 × 1 m strip along y = 0..1; plots 1–3 sit on one 1 m spot at x = 8
    // inside it; plot 4 covers x = 7..9, overlapping all of 0–3. With a cap of 2 it must still say 0.
    const plots: Rect[] = [
      { x: 0, y: 0, width: 10, length: 1, rotation: 0 },
      { x: 8, y: 0, width: 1, length: 1, rotation: 0 },
      { x: 8, y: 0, width: 1, length: 1, rotation: 0 },
      { x: 8, y: 0, width: 1, length: 1, rotation: 0 },
      { x: 7, y: 0, width: 2, length: 1, rotation: 0 },
    ];
    expect(firstOverlaps(plots, undefined, 2)[4]).toEqual({ with: 0, count: 2 });
  });
});
