import { describe, expect, it } from 'vitest';
import { readBoardParams, shiftsApiQuery, writeBoardParams } from './board-params';

const defaults = { today: '2026-07-08', siteIds: [3, 5] };
const read = (query: string) => readBoardParams(new URLSearchParams(query), defaults);

describe('the board’s choices in the page’s query', () => {
  it('opens this week’s list with no filters when the query is empty', () => {
    expect(read('')).toEqual({ date: '2026-07-06', siteId: undefined, kind: undefined, open: false, view: 'list', cal: 'month' });
  });

  it('reads a week, a site, a kind and the calendar view', () => {
    expect(read('date=2026-07-22&site=5&kind=water&open=true')).toMatchObject({ date: '2026-07-20', siteId: 5, kind: 'water', open: true, view: 'list' });
    expect(read('view=calendar&cal=agenda&date=2026-07-22')).toMatchObject({ view: 'calendar', cal: 'agenda', date: '2026-07-22' });
  });

  it('drops what is not ours rather than refusing the link', () => {
    expect(read('date=2026-02-30&site=9&kind=digging&cal=year&view=grid')).toEqual(read(''));
    expect(read('site=abc').siteId).toBeUndefined();
  });

  it('writes short links: defaults are left out, the other choices kept', () => {
    const current = read('site=3&kind=weed');
    expect(writeBoardParams(current, { date: '2026-07-13' }, defaults).toString()).toBe('date=2026-07-13&site=3&kind=weed');
    expect(writeBoardParams(current, { date: '2026-07-06' }, defaults).toString()).toBe('site=3&kind=weed');
    expect(writeBoardParams(current, { siteId: undefined, kind: undefined }, defaults).toString()).toBe('');
    expect(writeBoardParams(current, { view: 'calendar', date: '2026-07-08' }, defaults).toString()).toBe('site=3&kind=weed&view=calendar');
    expect(writeBoardParams(current, { view: 'calendar', cal: 'week', date: '2026-07-01' }, defaults).toString()).toBe(
      'date=2026-07-01&site=3&kind=weed&view=calendar&cal=week',
    );
  });

  it('round-trips: what is written reads back the same', () => {
    const choices = read('date=2026-08-03&site=5&kind=mixed&open=true&view=calendar&cal=week');
    expect(readBoardParams(writeBoardParams(choices, {}, defaults), defaults)).toEqual(choices);
  });

  it('asks the server with its own names, only for filters that are set', () => {
    expect(shiftsApiQuery({ from: '2026-07-06', to: '2026-07-12' })).toBe('?from=2026-07-06&to=2026-07-12');
    expect(shiftsApiQuery({ from: '2026-07-06', to: '2026-07-12', siteId: 3, kind: 'water', open: true })).toBe(
      '?from=2026-07-06&to=2026-07-12&siteId=3&kind=water&open=true',
    );
  });
});
