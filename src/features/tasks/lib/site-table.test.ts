import { describe, expect, it } from 'vitest';
import { addedWords, canDeleteTask, countWords, dateRangeError, whereWords, whoForWords, withFilter, withoutFilters } from './site-table';

describe('whoForWords', () => {
  it('names the holder for a plot’s task, the volunteers while the holder is away', () => {
    expect(whoForWords({ plotId: 3, forVolunteers: false }, 'in_ground')).toBe('Plot holder');
    expect(whoForWords({ plotId: 3, forVolunteers: true }, 'in_ground')).toBe('Volunteers, while the holder is away');
  });
  it('names the coordinators for the whole site and shared beds', () => {
    expect(whoForWords({ plotId: null, forVolunteers: false })).toBe('Coordinators');
    expect(whoForWords({ plotId: 9, forVolunteers: false }, 'shared_bed')).toBe('Coordinators');
  });
  it('calls a task on no plot the whole site', () => {
    expect(whereWords({ plotLabel: null })).toBe('Whole site');
    expect(whereWords({ plotLabel: 'A-1' })).toBe('A-1');
  });
});

describe('what the table allows and says', () => {
  it('deletes only the tasks a coordinator added', () => {
    expect(canDeleteTask({ origin: 'coordinator' })).toBe(true);
    expect(canDeleteTask({ origin: 'generated' })).toBe(false);
  });
  it('counts in words', () => {
    expect(addedWords(1)).toBe('Added 1 task.');
    expect(addedWords(12)).toBe('Added 12 tasks.');
    expect(countWords(1, false)).toBe('1 task');
    expect(countWords(0, true)).toBe('0 tasks (filtered)');
  });
  it('refuses dates the wrong way round, as the server does', () => {
    expect(dateRangeError({ from: '2026-06-10', to: '2026-06-01' })).toBe('Must be on or after the first date');
    expect(dateRangeError({ from: '2026-06-01', to: '2026-06-01' })).toBeNull();
    expect(dateRangeError({ from: '2026-06-10' })).toBeNull();
  });
});

describe('withFilter', () => {
  it('sets one filter and keeps the others in the API’s order', () => {
    const next = withFilter(new URLSearchParams('status=open&kind=weed'), 'from', '2026-06-01');
    expect(next.toString()).toBe('from=2026-06-01&kind=weed&status=open');
  });
  it('removes a filter set to nothing, and keeps params that are not filters', () => {
    const next = withFilter(new URLSearchParams('kind=water&plotId=4&tab=x'), 'kind', '');
    expect(next.toString()).toBe('plotId=4&tab=x');
  });
  it('clears every filter', () => {
    expect(withoutFilters(new URLSearchParams('kind=water&to=2026-07-01&tab=x')).toString()).toBe('tab=x');
  });
});
