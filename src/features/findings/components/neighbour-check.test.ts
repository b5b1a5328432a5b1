import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { FindingView } from '@shared/schemas/findings';
import { NeighbourCheck, type NeighbourCheckProps } from './neighbour-check';

function finding(over: Partial<FindingView>): FindingView {
  return {
    key: 'k',
    severity: 'watch',
    kind: 'shade',
    rule: 'shade',
    title: 'Shaded at noon',
    message: 'The sweetcorn on B4 casts 1.1 m of shade at noon on 21 June.',
    plantingId: 1,
    plotId: 10,
    plotLabel: 'A1',
    cropName: 'Lettuce',
    seasonYear: 2027,
    peers: [],
    source: { id: 'tillwell', title: 'Sun position worked out for the site', evidence: 'computed' },
    numbers: { shadowM: 1.1 },
    keptReason: null,
    ...over,
  };
}

const words = (html: string) => html.replace(/<[^>]+>/g, ' ').replace(/&#x27;/g, "'").replace(/\s+/g, ' ');
const text = (props: NeighbourCheckProps) => words(renderToStaticMarkup(createElement(NeighbourCheck, props)));
const plantings = [
  { id: 1, name: 'Lettuce' },
  { id: 2, name: 'Carrot ‘Nantes’' },
];

describe('NeighbourCheck', () => {
  it('says when nothing is planted and when nothing is found', () => {
    expect(text({ findings: [], plantings: [], showKeptReasons: true })).toContain('Nothing planted to check yet.');
    expect(text({ findings: [], plantings, showKeptReasons: true })).toContain("Nothing found for this season's plantings.");
  });

  it('groups findings under their planting, counts them and names the plantings with none', () => {
    const html = renderToStaticMarkup(
      createElement(NeighbourCheck, {
        findings: [finding({}), finding({ key: 'c', severity: 'clash', title: 'Keep apart', keptReason: 'Trying it once' })],
        plantings,
        showKeptReasons: false,
      }),
    );
    expect(html).toMatch(/<h3[^>]*>Lettuce<\/h3>/);
    expect(html).toContain('aria-label="Findings for Lettuce"');
    const t = words(html);
    expect(t).toContain('Found 1 clash and 1 to watch.');
    expect(t).toContain('Nothing found for Carrot ‘Nantes’.');
    expect(t).toContain('(computed)');
    expect(t).not.toContain('Kept:');
  });
});
