/**
 * How a plot's label and status word fit on its tile: stacked on two lines, on one line, the
 * label alone, or nothing (the map's "Too small to label" key then names it).
 */
export type TileLayout = 'stack' | 'line' | 'label' | 'none';

/** A generous width of one character in em, so an estimate never comes out narrower than the text drawn. */
function charEm(c: string): number {
  if (c === ' ') return 0.3;
  if (/[A-Z0-9]/.test(c)) return 0.7;
  if (/[mw]/.test(c)) return 0.85;
  if (/[a-z]/.test(c)) return 0.6;
  if (/[-.,:'?]/.test(c)) return 0.45;
  return 0.9;
}

export function textWidth(text: string, px: number): number {
  let em = 0;
  for (const c of text) em += charEm(c);
  return em * px;
}

const LINE = 1.25; // Tailwind's leading-tight

/**
 * Picks the layout and font size for a tile whose inside is `width` × `height` pixels: the first
 * of stack, line, label that fits at `minPx` or more, at the largest size up to `maxPx`.
 */
export function fitTileText(label: string, word: string | null, width: number, height: number, minPx: number, maxPx: number): { layout: TileLayout; px: number } {
  const tries: Array<[TileLayout, (px: number) => boolean]> = [];
  if (word) {
    tries.push(['stack', (px) => Math.max(textWidth(label, px), textWidth(word, px)) <= width && 2 * LINE * px <= height]);
    tries.push(['line', (px) => textWidth(`${label} ${word}`, px) <= width && LINE * px <= height]);
  }
  tries.push(['label', (px) => textWidth(label, px) <= width && LINE * px <= height]);
  for (const [layout, fits] of tries) {
    for (let px = maxPx; px >= minPx; px -= 0.5) if (fits(px)) return { layout, px };
  }
  return { layout: 'none', px: minPx };
}
