import { describe, expect, it } from 'vitest';
import { chartDepth, chartLayout, chartSummary, chartWeeks, currentWeek, methodOf, methodWords, niceScale, ruleOfThumbWords } from './water';

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

describe('chartLayout', () => {
  const frame = { width: 200, height: 120, left: 20, right: 0, top: 20, bottom: 0 };
  const data = {
    top: 20,
    step: 10,
    weeks: [
      { weekStart: '2026-06-01', need: 20, rain: 5, deficit: 15, methods: '' },
      { weekStart: '2026-06-08', need: 10, rain: 0, deficit: 10, methods: '' },
    ],
  };
  it('puts the ticks from the baseline up to the top', () => {
    const l = chartLayout(data, frame);
    // computed: plot height 120 − 20 = 100 units for 20 mm; ticks at 0, 10, 20 mm
    expect(l.ticks).toEqual([
      { value: 0, y: 120 },
      { value: 10, y: 70 },
      { value: 20, y: 20 },
    ]);
  });
  it('gives each week a slot with need then rain side by side, heights to scale', () => {
    const [first, second] = chartLayout(data, frame).bars;
    // computed: slot = 180 ÷ 2 = 90; bars start 20 + 0.15 × 90 = 33.5, each 0.35 × 90 = 31.5 wide
    expect(first.need).toEqual({ x: 33.5, y: 20, width: 31.5, height: 100 });
    // computed: rain 5 mm of 20 → 25 units tall, beside the need bar at 33.5 + 31.5 = 65
    expect(first.rain).toEqual({ x: 65, y: 95, width: 31.5, height: 25 });
    expect(first.centre).toBe(65);
    // computed: second slot starts at 20 + 90; need 10 mm → 50 units; no rain → no height
    expect(second.need).toEqual({ x: 123.5, y: 70, width: 31.5, height: 50 });
    expect(second.rain.height).toBe(0);
  });
  it('never draws past the top or below the baseline', () => {
    const [bar] = chartLayout({ ...data, weeks: [{ ...data.weeks[0], need: 50, rain: -3 }] }, frame).bars;
    expect(bar.need.y).toBe(20);
    expect(bar.rain.height).toBe(0);
  });
});

describe('chartSummary', () => {
  const label = (iso: string) => iso.slice(5);
  it('says the span and the weeks of most need and most rain', () => {
    const weeks = [
      { weekStart: '2026-06-01', need: 20, rain: 5, deficit: 15, methods: '' },
      { weekStart: '2026-06-08', need: 24.4, rain: 30, deficit: 0, methods: '' },
      { weekStart: '2026-06-15', need: 24.4, rain: 0, deficit: 24.4, methods: '' },
    ];
    expect(chartSummary(weeks, 'metric', label)).toBe(
      'Water need and rain logged per week, 3 weeks from 06-01 to the week of 06-15: the most need was 24 mm in the week of 06-08; the most rain 30 mm in the week of 06-08.',
    );
  });
  it('says so when nothing was needed or logged, in inches on US sites', () => {
    const weeks = [{ weekStart: '2026-11-30', need: 0, rain: 0, deficit: 0, methods: '' }];
    expect(chartSummary(weeks, 'us', label)).toBe('Water need and rain logged per week, the week of 11-30: no water was needed; no rain was logged.');
    expect(chartDepth(0.984, 'us')).toBe('0.98 in');
    expect(chartDepth(4.46, 'metric')).toBe('4.5 mm');
    expect(chartSummary([], 'metric', label)).toBe('Water need and rain logged per week: no weeks to show.');
  });
});
