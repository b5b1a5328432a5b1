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
