import { describe, expect, it } from 'vitest';
import { filtersFromParams, filtersQuery, isFiltered } from './filters';

describe('filtersFromParams', () => {
  it('reads every filter the page keeps in its URL', () => {
    const f = filtersFromParams(new URLSearchParams('from=2026-06-01&to=2026-06-30&kind=water&plotId=12&status=open'), [12, 13]);
    expect(f).toEqual({ from: '2026-06-01', to: '2026-06-30', kind: 'water', plotId: 12, status: 'open' });
  });

  it('drops values that are not real: a bad date, an unknown kind or status, a plot of another site', () => {
    const f = filtersFromParams(new URLSearchParams('from=2026-02-30&to=June&kind=prune&status=late&plotId=99'), [12]);
    expect(f).toEqual({});
  });

  it('takes any whole plot id when the plots are not known yet, but never zero or text', () => {
    expect(filtersFromParams(new URLSearchParams('plotId=7')).plotId).toBe(7);
    expect(filtersFromParams(new URLSearchParams('plotId=0')).plotId).toBeUndefined();
    expect(filtersFromParams(new URLSearchParams('plotId=7x')).plotId).toBeUndefined();
  });
});

describe('filtersQuery', () => {
  it('writes the set filters in a fixed order for the API and the CSV link', () => {
    expect(filtersQuery({ status: 'done', kind: 'weed', from: '2026-06-01' })).toBe('?from=2026-06-01&kind=weed&status=done');
    expect(filtersQuery({ plotId: 3 })).toBe('?plotId=3');
  });
  it('is empty with no filters', () => {
    expect(filtersQuery({})).toBe('');
    expect(isFiltered({})).toBe(false);
    expect(isFiltered({ kind: 'water' })).toBe(true);
  });
  it('round-trips through the URL', () => {
    const filters = { from: '2026-06-01', to: '2026-06-07', kind: 'thin' as const, plotId: 4, status: 'skipped' as const };
    expect(filtersFromParams(new URLSearchParams(filtersQuery(filters).slice(1)), [4])).toEqual(filters);
  });
});
