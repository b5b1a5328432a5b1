import type { UnitSystem } from '@shared/geometry';
import type { WaterSummary } from '@shared/schemas/tasks';
import { addDaysTo } from './dates';
import { depthIn } from './units';

type WaterWeek = WaterSummary['weeks'][number];

type Method = 'penman' | 'hargreaves' | 'thumb';

const methodNames: Record<Method, string> = {
  penman: 'Penman-Monteith',
  hargreaves: 'Hargreaves',
  thumb: 'rule of thumb',
};
const methodOrder: readonly Method[] = ['penman', 'hargreaves', 'thumb'];

/** Which method a key of the server's `methods` names ("penman_monteith", "Hargreaves", "rule-of-thumb"…); null for one we do not know. */
export function methodOf(key: string): Method | null {
  const k = key.toLowerCase().replace(/[^a-z0-9]/g, '');
  if (k.startsWith('penman') || k === 'pm' || k === 'fao56') return 'penman';
  if (k.startsWith('hargreaves')) return 'hargreaves';
  if (k.includes('thumb')) return 'thumb';
  return null;
}

function days(n: number): string {
  return `${n} ${n === 1 ? 'day' : 'days'}`;
}

/**
 * Which ET0 method each day of a week used, in words: "Penman-Monteith 5 days, Hargreaves 2 days". Known methods
 * come first in that order; a key we do not know is shown in words as it came; days of 0 are left out.
 */
export function methodWords(methods: Record<string, number>): string {
  const known = new Map<Method, number>();
  const other: Array<[string, number]> = [];
  for (const [key, count] of Object.entries(methods)) {
    if (!(count > 0)) continue;
    const m = methodOf(key);
    if (m) known.set(m, (known.get(m) ?? 0) + count);
    else other.push([key.replace(/[_-]+/g, ' '), count]);
  }
  const parts = [
    ...methodOrder.filter((m) => known.has(m)).map((m) => `${methodNames[m]} ${days(known.get(m)!)}`),
    ...other.map(([name, count]) => `${name} ${days(count)}`),
  ];
  if (parts.length === 0) return 'No days worked out';
  const text = parts.join(', ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The rule of thumb in the site's units: about 25 mm, or 1 inch, of water a week (common practice). */
export function ruleOfThumbWords(units: UnitSystem): string {
  return units === 'us' ? 'about 1 inch of water a week' : 'about 25 mm of water a week';
}

/** The week holding `today` (its first day on or before today, within 7 days); else the newest week; null when there are none. */
export function currentWeek(weeks: readonly WaterWeek[], today: string): WaterWeek | null {
  const holding = weeks.find((w) => w.weekStart <= today && today < addDaysTo(w.weekStart, 7));
  if (holding) return holding;
  return [...weeks].sort((a, b) => b.weekStart.localeCompare(a.weekStart))[0] ?? null;
}

/** A round top for a chart's axis and its step: the smallest of 1, 2, 2.5 or 5 × 10ⁿ steps that fits `max` in at most `maxTicks` steps. */
export function niceScale(max: number, maxTicks = 5): { top: number; step: number } {
  if (!(max > 0)) return { top: 1, step: 0.25 };
  const rough = max / maxTicks;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s * maxTicks >= max) ?? 10 * power;
  const top = Math.ceil(max / step - 1e-9) * step;
  return { top: Number(top.toPrecision(12)), step: Number(step.toPrecision(12)) };
}

export interface ChartWeek {
  weekStart: string;
  need: number;
  rain: number;
  /** Need above rain (never below 0), in the site's depth unit. */
  deficit: number;
  methods: string;
}

/** The past weeks for the water chart, oldest first, in the site's depth unit, with the axis's top and step. */
export function chartWeeks(weeks: readonly WaterWeek[], units: UnitSystem): { weeks: ChartWeek[]; top: number; step: number } {
  const rows = [...weeks]
    .sort((a, b) => a.weekStart.localeCompare(b.weekStart))
    .map((w) => ({
      weekStart: w.weekStart,
      need: depthIn(w.needMm, units),
      rain: depthIn(w.rainMm, units),
      deficit: depthIn(Math.max(0, w.deficitMm), units),
      methods: methodWords(w.methods),
    }));
  const max = Math.max(0, ...rows.map((r) => Math.max(r.need, r.rain)));
  return { weeks: rows, ...niceScale(max) };
}

/** The chart's drawing area inside its viewBox, in SVG units. */
export interface ChartFrame {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** The water chart's default frame: room on the left for the axis numbers, below for the weeks. */
export const WATER_CHART_FRAME: ChartFrame = { width: 640, height: 260, left: 44, right: 8, top: 24, bottom: 36 };

export interface ChartBar {
  weekStart: string;
  /** Centre of the week's group, for its label. */
  centre: number;
  need: { x: number; y: number; width: number; height: number };
  rain: { x: number; y: number; width: number; height: number };
}

export interface ChartLayout {
  frame: ChartFrame;
  /** Baseline (value 0) and top of the plot area, in SVG units. */
  baseY: number;
  topY: number;
  ticks: Array<{ value: number; y: number }>;
  bars: ChartBar[];
}

const r2 = (v: number) => Math.round(v * 100) / 100;

/**
 * Where each week's two bars (need, then rain) go: one slot per week across the plot area, the pair taking
 * 70 % of its slot; heights on a linear scale from 0 at the baseline to `top` at the top. Numbers are rounded to
 * 0.01 so the SVG stays small.
 */
export function chartLayout(data: { weeks: readonly ChartWeek[]; top: number; step: number }, frame: ChartFrame = WATER_CHART_FRAME): ChartLayout {
  const baseY = frame.height - frame.bottom;
  const topY = frame.top;
  const plotW = frame.width - frame.left - frame.right;
  const scale = (v: number) => (data.top > 0 ? (Math.max(0, Math.min(v, data.top)) / data.top) * (baseY - topY) : 0);
  const ticks: ChartLayout['ticks'] = [];
  for (let i = 0; i * data.step <= data.top + 1e-9; i++) {
    const value = Number((i * data.step).toPrecision(12));
    ticks.push({ value, y: r2(baseY - scale(value)) });
  }
  const slot = data.weeks.length ? plotW / data.weeks.length : 0;
  const barW = (slot * 0.7) / 2;
  const bars = data.weeks.map((w, i) => {
    const start = frame.left + i * slot + slot * 0.15;
    const needH = scale(w.need);
    const rainH = scale(w.rain);
    return {
      weekStart: w.weekStart,
      centre: r2(frame.left + (i + 0.5) * slot),
      need: { x: r2(start), y: r2(baseY - needH), width: r2(barW), height: r2(needH) },
      rain: { x: r2(start + barW), y: r2(baseY - rainH), width: r2(barW), height: r2(rainH) },
    };
  });
  return { frame, baseY, topY, ticks, bars };
}

/** A depth on the chart's axis or in its summary, in the site's unit: "12 mm", "0.5 in". */
export function chartDepth(value: number, units: UnitSystem): string {
  return units === 'us' ? `${Number(value.toFixed(2))} in` : `${Number(value.toFixed(value >= 10 ? 0 : 1))} mm`;
}

/**
 * The chart in one sentence, for its aria-label: how many weeks, from when to when, and the weeks of the most need
 * and the most rain. Ties go to the earlier week.
 */
export function chartSummary(weeks: readonly ChartWeek[], units: UnitSystem, weekLabel: (iso: string) => string): string {
  if (weeks.length === 0) return 'Water need and rain logged per week: no weeks to show.';
  const most = (pick: (w: ChartWeek) => number) => weeks.reduce((best, w) => (pick(w) > pick(best) ? w : best), weeks[0]);
  const need = most((w) => w.need);
  const rain = most((w) => w.rain);
  const span = weeks.length === 1 ? `the week of ${weekLabel(weeks[0].weekStart)}` : `${weeks.length} weeks from ${weekLabel(weeks[0].weekStart)} to the week of ${weekLabel(weeks[weeks.length - 1].weekStart)}`;
  const needText = need.need > 0 ? `the most need was ${chartDepth(need.need, units)} in the week of ${weekLabel(need.weekStart)}` : 'no water was needed';
  const rainText = rain.rain > 0 ? `the most rain ${chartDepth(rain.rain, units)} in the week of ${weekLabel(rain.weekStart)}` : 'no rain was logged';
  return `Water need and rain logged per week, ${span}: ${needText}; ${rainText}.`;
}
