import { describe, expect, it } from 'vitest';
import type { FindingView } from '@shared/schemas/findings';
import { errorText, evidenceWords, findingCounts, groupByPlanting, hasClash, peerText, sortFindings } from './wording';

function finding(over: Partial<FindingView>): FindingView {
  return {
    key: 'rotation_family:1',
    severity: 'watch',
    kind: 'rotation',
    rule: 'rotation_family',
    title: 'Same family',
    message: 'Potato grew here 1 year ago.',
    plantingId: 1,
    plotId: 10,
    plotLabel: 'A1',
    cropName: 'Tomato',
    seasonYear: 2027,
    peers: [],
    source: { id: 'x', title: 'X', evidence: 'published' },
    numbers: {},
    keptReason: null,
    ...over,
  };
}

describe('evidenceWords', () => {
  it('says each evidence level in words', () => {
    expect(evidenceWords('published')).toBe('published source');
    expect(evidenceWords('common_practice')).toBe('common practice');
    expect(evidenceWords('from_memory')).toBe('from memory');
    expect(evidenceWords('research')).toBe('research');
    expect(evidenceWords('computed')).toBe('computed');
  });
  it('shows a level it does not know without underscores', () => {
    expect(evidenceWords('field_trial')).toBe('field trial');
  });
});

describe('sortFindings', () => {
  it('puts clashes first, then watch, then good, keeping the order within each', () => {
    const list = [
      finding({ key: 'g1', severity: 'good' }),
      finding({ key: 'w1', severity: 'watch' }),
      finding({ key: 'c1', severity: 'clash' }),
      finding({ key: 'w2', severity: 'watch' }),
      finding({ key: 'c2', severity: 'clash' }),
    ];
    expect(sortFindings(list).map((f) => f.key)).toEqual(['c1', 'c2', 'w1', 'w2', 'g1']);
  });
});

describe('findingCounts and hasClash', () => {
  it('counts each severity in words', () => {
    const list = [finding({ severity: 'clash' }), finding({ severity: 'clash' }), finding({ severity: 'watch' }), finding({ severity: 'good' })];
    expect(findingCounts(list)).toBe('2 clashes, 1 to watch and 1 good pairing');
    expect(findingCounts([finding({ severity: 'good' }), finding({ severity: 'good' })])).toBe('2 good pairings');
    expect(findingCounts([])).toBe('');
  });
  it('sees a clash only when there is one', () => {
    expect(hasClash([finding({ severity: 'watch' }), finding({ severity: 'good' })])).toBe(false);
    expect(hasClash([finding({ severity: 'watch' }), finding({ severity: 'clash' })])).toBe(true);
  });
});

describe('peerText', () => {
  const peer = { plantingId: 7, plotId: 10, plotLabel: 'A1', cropName: 'Potato', seasonYear: 2026 };
  it('says "this plot" for the finding’s own plot and names any other', () => {
    expect(peerText(peer, { plotId: 10 })).toBe('Potato on this plot, 2026');
    expect(peerText({ ...peer, plotId: 11, plotLabel: 'B4' }, { plotId: 10 })).toBe('Potato on plot B4, 2026');
  });
});

describe('groupByPlanting', () => {
  it('groups in the plantings’ order, drops plantings with nothing found, sorts each group and keeps strays last', () => {
    const plantings = [
      { id: 1, name: 'Tomato' },
      { id: 2, name: 'Carrot' },
      { id: 3, name: 'Leek' },
    ];
    const groups = groupByPlanting(
      [
        finding({ key: 'a', plantingId: 3, severity: 'good' }),
        finding({ key: 'b', plantingId: 1, severity: 'watch' }),
        finding({ key: 'c', plantingId: 99, cropName: 'Bean' }),
        finding({ key: 'd', plantingId: 1, severity: 'clash' }),
      ],
      plantings,
    );
    expect(groups.map((g) => [g.plantingId, g.name, g.findings.map((f) => f.key)])).toEqual([
      [1, 'Tomato', ['d', 'b']],
      [3, 'Leek', ['a']],
      [99, 'Bean', ['c']],
    ]);
  });
});

describe('errorText', () => {
  it('adds the field messages that differ from the main one', () => {
    expect(errorText({ message: 'Some fields need attention.', fields: { date: 'Use a date like 2027-04-12' } })).toBe(
      'Some fields need attention. Use a date like 2027-04-12',
    );
    expect(errorText({ message: 'Too far ahead', fields: { plantedOn: 'Too far ahead' } })).toBe('Too far ahead');
    expect(errorText({ message: 'Gone.' })).toBe('Gone.');
  });
});
