import { describe, expect, it } from 'vitest';
import { chartWeeks, currentWeek, methodOf, methodWords, niceScale, ruleOfThumbWords } from './water';

const week = (weekStart: string, over: Partial<{ needMm: number; rainMm: number; deficitMm: number; litres: number; methods: Record<string, number> }> = {}) => ({
  weekStart,
  needMm: 25,
  rainMm: 10,
  deficitMm: 15,
  litres: 270,
  methods: { penman_monteith: 7 },
  ...over,
});

describe('methodWords', () => {
  it('names each ET0 method with its days, Penman-Monteith first', () => {
    expect(methodWords({ hargreaves: 2, penman_monteith: 5 })).toBe('Penman-Monteith 5 days, Hargreaves 2 days');
    expect(methodWords({ 'rule-of-thumb': 1 })).toBe('Rule of thumb 1 day');
  });
  it('reads the method names however the keys are written', () => {
    expect(methodOf('Penman-Monteith')).toBe('penman');
    expect(methodOf('HARGREAVES')).toBe('hargreaves');
    expect(methodOf('rule_of_thumb')).toBe('thumb');
    expect(methodOf('priestley_taylor')).toBeNull();
  });
  it('keeps a method it does not know, in words, and leaves out days of 0', () => {
    expect(methodWords({ penman_monteith: 0, priestley_taylor: 3 })).toBe('Priestley taylor 3 days');
    expect(methodWords({})).toBe('No days worked out');
  });
  it('gives the rule of thumb in the site’s units', () => {
    // common practice: about 1 inch (25 mm) of water a week for a vegetable garden.
    expect(ruleOfThumbWords('metric')).toBe('about 25 mm of water a week');
    expect(ruleOfThumbWords('us')).toBe('about 1 inch of water a week');
  });
});

describe('currentWeek', () => {
  const weeks = [week('2026-06-01'), week('2026-06-08'), week('2026-05-25')];
  it('finds the week holding today, its last day included', () => {
    expect(currentWeek(weeks, '2026-06-08')?.weekStart).toBe('2026-06-08');
    expect(currentWeek(weeks, '2026-06-07')?.weekStart).toBe('2026-06-01');
    expect(currentWeek(weeks, '2026-06-14')?.weekStart).toBe('2026-06-08');
  });
  it('falls back to the newest week, or null', () => {
    expect(currentWeek(weeks, '2026-07-01')?.weekStart).toBe('2026-06-08');
    expect(currentWeek([], '2026-07-01')).toBeNull();
  });
});

describe('niceScale', () => {
  it('rounds the axis up to a tidy step', () => {
    // computed: 37 ÷ 5 = 7.4 → step 10, top 40
    expect(niceScale(37)).toEqual({ top: 40, step: 10 });
    // computed: 1.3 ÷ 5 = 0.26 → step 0.5, top 1.5
    expect(niceScale(1.3)).toEqual({ top: 1.5, step: 0.5 });
    // computed: 20 ÷ 5 = 4 → step 5, top 20
    expect(niceScale(20)).toEqual({ top: 20, step: 5 });
  });
  it('has a scale even when every week is 0', () => {
    expect(niceScale(0).top).toBeGreaterThan(0);
  });
});

describe('chartWeeks', () => {
  it('orders weeks oldest first and converts to inches on US sites', () => {
    const out = chartWeeks([week('2026-06-08', { needMm: 25.4, rainMm: 0, deficitMm: 25.4 }), week('2026-06-01')], 'us');
    expect(out.weeks.map((w) => w.weekStart)).toEqual(['2026-06-01', '2026-06-08']);
    // computed: 25.4 mm ÷ 25.4 = 1 in (NIST Handbook 44)
    expect(out.weeks[1].need).toBeCloseTo(1, 12);
    expect(out.weeks[1].deficit).toBeCloseTo(1, 12);
    expect(out.top).toBeGreaterThanOrEqual(1);
  });
  it('never draws a negative deficit', () => {
    const out = chartWeeks([week('2026-06-01', { needMm: 10, rainMm: 30, deficitMm: -20 })], 'metric');
    expect(out.weeks[0].deficit).toBe(0);
    // computed: the biggest bar is 30 mm of rain → step 10, top 30
    expect(out.top).toBe(30);
  });
});
