import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { SAFETY_CAUTION } from '@shared/crops/caution';
import { companionCaution } from '@shared/crops/relations';
import type { FindingView } from '@shared/schemas/findings';
import { FindingList, type FindingListProps } from './finding-list';

function finding(over: Partial<FindingView>): FindingView {
  return {
    key: 'k',
    severity: 'watch',
    kind: 'rotation',
    rule: 'rotation_family',
    title: 'Same family within 3 years',
    message: 'Potato grew on this plot 1 year ago; the club waits 3 years.',
    plantingId: 1,
    plotId: 10,
    plotLabel: 'A1',
    cropName: 'Tomato',
    seasonYear: 2027,
    peers: [{ plantingId: 7, plotId: 10, plotLabel: 'A1', cropName: 'Potato', seasonYear: 2026 }],
    source: { id: 's', title: 'A rotation guide', evidence: 'published', url: 'https://example.org/rotation' },
    numbers: {},
    keptReason: null,
    ...over,
  };
}

const render = (props: FindingListProps) => renderToStaticMarkup(createElement(FindingList, props));
const text = (html: string) => html.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ');

describe('FindingList', () => {
  it('says so when there is nothing', () => {
    expect(text(render({ findings: [], label: 'Findings' }))).toContain('Nothing found for this planting.');
  });

  it('shows severity in words, title, message, peers and the source with its evidence level, clashes first', () => {
    const html = render({
      findings: [finding({ key: 'w' }), finding({ key: 'c', severity: 'clash', title: 'Keep apart', source: { id: 'f', title: 'Folk chart', evidence: 'from_memory' } })],
      label: 'Findings for Tomato',
      headingLevel: 4,
    });
    const t = text(html);
    expect(html).toContain('aria-label="Findings for Tomato"');
    expect(html.match(/<h4/g)).toHaveLength(2);
    expect(t.indexOf('Clash')).toBeLessThan(t.indexOf('Watch'));
    expect(t).toContain('Same family within 3 years');
    expect(t).toContain('Potato grew on this plot 1 year ago');
    expect(t).toContain('With: Potato on this plot, 2026');
    expect(t).toContain('(published source)');
    expect(t).toContain('(from memory)');
    expect(html).toContain('href="https://example.org/rotation"');
    // Each finding carries a drawn mark besides its words, hidden from screen readers.
    expect(html.match(/<svg[^>]*aria-hidden="true"/g)).toHaveLength(2);
  });

  it('shows the keep reason on a clash only, and only when asked to', () => {
    const findings = [finding({ key: 'c', severity: 'clash', keptReason: 'Only sunny corner' }), finding({ key: 'w', keptReason: 'ignored on a watch' })];
    const shown = text(render({ findings, label: 'F' }));
    expect(shown).toContain('Kept: Only sunny corner');
    expect(shown).not.toContain('ignored on a watch');
    expect(text(render({ findings, label: 'F', showKeptReasons: false }))).not.toContain('Kept:');
  });

  it('adds the safety caution to a message about lime and the companion caution to a folk pairing', () => {
    const t = text(
      render({
        findings: [
          finding({ key: 'ph', kind: 'site_fit', message: 'The soil is at pH 5.5; brassicas want 6.5 or more, usually reached with lime.' }),
          finding({ key: 'pair', severity: 'good', kind: 'companion', source: { id: 'x', title: 'Gardeners', evidence: 'common_practice' } }),
        ],
        label: 'F',
      }),
    );
    expect(t).toContain(SAFETY_CAUTION);
    expect(t).toContain(companionCaution.value);
    expect(t).toContain('(common practice)');
  });

  it('leaves the cautions out when nothing calls for them', () => {
    const t = text(render({ findings: [finding({ kind: 'companion', source: { id: 'r', title: 'Trial', evidence: 'research' } })], label: 'F' }));
    expect(t).not.toContain(SAFETY_CAUTION);
    expect(t).not.toContain(companionCaution.value);
    expect(t).toContain('(research)');
  });
});
