import { describe, expect, it } from 'vitest';
import { addHoursToTime, estimateHours, plotsInWords, shiftCaution, shiftState, suggestCapacity, suggestShifts, weekdayOf, type OpenTask } from './index';

const task = (id: number, over: Partial<OpenTask> = {}): OpenTask => ({ id, siteId: 1, kind: 'water', dueOn: '2026-07-14', plotLabel: `B-${id}`, amountL: 20, ...over });

describe('suggestShifts', () => {
  it('groups by site, date and kind, and names the shift by its day, time, plots and water', () => {
    const tasks = [1, 2, 3, 4, 5, 6, 7, 8, 9].map((i) => task(i));
    const [s] = suggestShifts(tasks);
    // 14 July 2026 is a Tuesday (computed from the calendar)
    expect(s.title).toBe('Tuesday evening watering, plots B-1 to B-9 (9 plots), about 180 L');
    expect(s.taskIds).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    // computed: 9 × 5 min + 180 L × 1 min / 10 L = 63 min → 1.25 h (quarter hours, rounded up); 1 place of up to 1.5 h
    expect(s.estHours).toBe(1.25);
    expect(s.capacity).toBe(1);
    expect([s.startTime, s.endTime]).toEqual(['18:00', '19:30']);
    expect(s.amountL).toBe(180);
  });

  it('keeps other days, kinds and sites apart, in order of date and time', () => {
    const out = suggestShifts([
      task(1, { dueOn: '2026-07-15' }),
      task(2, { kind: 'weed', amountL: null }),
      task(3),
      task(4, { siteId: 2 }),
    ]);
    expect(out.map((s) => [s.date, s.siteId, s.kind, s.taskIds])).toEqual([
      ['2026-07-14', 1, 'weed', [2]],
      ['2026-07-14', 1, 'water', [3]],
      ['2026-07-14', 2, 'water', [4]],
      ['2026-07-15', 1, 'water', [1]],
    ]);
    expect(out[0].startTime).toBe('10:00');
    expect(out[0].title).toBe('Tuesday morning weeding, plot B-2');
  });

  it('shows US gallons on a US site: 180 L is 47.6 US gal (1 US gal = 3.785411784 L, NIST Handbook 44)', () => {
    const [s] = suggestShifts([1, 2, 3, 4, 5, 6, 7, 8, 9].map((i) => task(i)), { units: 'us' });
    expect(s.title).toMatch(/about 48 US gal$/);
  });

  it('names the shared beds when tasks have no plot', () => {
    const [s] = suggestShifts([task(1, { plotLabel: null, kind: 'mulch', amountL: null })]);
    expect(s.title).toBe('Tuesday morning mulching, the shared beds');
    expect(s.plotLabels).toEqual([]);
  });
});

describe('hours and places', () => {
  it('estimates at least half an hour, in quarter hours', () => {
    expect(estimateHours([{ kind: 'scout', amountL: null }])).toBe(0.5);
    // computed: 4 × 20 min weeding = 80 min → 1.5 h (rounded up to the quarter)
    expect(estimateHours(Array.from({ length: 4 }, () => ({ kind: 'weed' as const, amountL: null })))).toBe(1.5);
  });
  it('suggests a place per 1.5 hours', () => {
    expect([0.5, 1.5, 1.75, 3, 4.5, 4.75].map(suggestCapacity)).toEqual([1, 1, 2, 2, 3, 4]);
  });
  it('adds hours to a wall-clock time and stops before midnight', () => {
    expect(addHoursToTime('18:00', 1.5)).toBe('19:30');
    expect(addHoursToTime('23:00', 2)).toBe('23:59');
  });
  it('reads weekdays from the calendar date', () => {
    // 1 January 2026 was a Thursday (calendar)
    expect(weekdayOf('2026-01-01')).toBe('Thursday');
  });
  it('lists up to three plots by name', () => {
    expect(plotsInWords(['A-10', 'A-2', 'A-1'])).toBe('plots A-1, A-2 and A-10');
    expect(plotsInWords(['A-1', null])).toBe('plot A-1 and the shared beds');
  });
});

describe('cautions', () => {
  it('warns of heat and weight for watering, labels for fertiliser, tools for weeding', () => {
    expect(shiftCaution(['water'])).toMatch(/10 kg/);
    expect(shiftCaution(['side_dress'])).toMatch(/product label/i);
    expect(shiftCaution(['weed'])).toMatch(/gloves/i);
    for (const k of ['water', 'weed', 'mixed'] as const) expect(shiftCaution([k])).toMatch(/rest if you feel unwell/);
  });
});

describe('shiftState', () => {
  const ends = new Date('2026-07-14T18:30:00Z');
  const before = new Date('2026-07-14T12:00:00Z');
  const s = { calledOff: false, endsAt: ends, capacity: 2 };
  it('needs people until every place is taken', () => {
    expect(shiftState(s, [{ status: 'taken' }, { status: 'released' }], before)).toBe('needs_people');
    expect(shiftState(s, [{ status: 'taken' }, { status: 'taken' }], before)).toBe('covered');
  });
  it('is done once someone marks it done, and not done when it ended without that', () => {
    expect(shiftState(s, [{ status: 'done' }], before)).toBe('done');
    expect(shiftState(s, [{ status: 'missed' }], ends)).toBe('not_done');
    expect(shiftState({ ...s, calledOff: true }, [{ status: 'done' }], before)).toBe('called_off');
  });
});
