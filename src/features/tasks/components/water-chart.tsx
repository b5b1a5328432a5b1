import { useEffect, useMemo, useRef, useState } from 'react';
import type { UnitSystem } from '@shared/geometry';
import type { WaterSummary } from '@shared/schemas/tasks';
import { shortDate, taskDate } from '../lib/dates';
import { formatDepth, formatVolume } from '../lib/units';
import { chartDepth, chartLayout, chartSummary, chartWeeks, WATER_CHART_FRAME } from '../lib/water';

// The palette's clay and water: both at least 3:1 on white (WCAG 1.4.11), and told apart by the legend's words,
// the order in each pair (need first) and the table below, never by colour alone.
const NEED_FILL = 'fill-clay';
const RAIN_FILL = 'fill-water';

/** The width of an element in CSS pixels, followed as it changes; the fallback until it is measured. */
function useWidth(fallback: number) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(fallback);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(([entry]) => {
      const w = Math.round(entry.contentRect.width);
      if (w > 0) setWidth(w);
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

/**
 * The past weeks' need against the rain logged, as our own SVG: two bars a week on one scale in the site's depth
 * unit. Drawn at the width it is shown at, so its words stay readable on a phone; one sentence names it for screen
 * readers, and the same numbers follow in a table.
 */
export function WaterChart({ weeks, units, today }: { weeks: WaterSummary['weeks']; units: UnitSystem; today: string }) {
  const data = useMemo(() => chartWeeks(weeks, units), [weeks, units]);
  const { ref, width } = useWidth(WATER_CHART_FRAME.width);
  const frame = { ...WATER_CHART_FRAME, width: Math.max(280, width), height: width < 480 ? 220 : WATER_CHART_FRAME.height };
  const layout = chartLayout(data, frame);
  const summary = chartSummary(data.weeks, units, (iso) => shortDate(iso));
  const byWeek = new Map(weeks.map((w) => [w.weekStart, w]));

  return (
    <div className="flex flex-col gap-4">
      <div ref={ref} className="w-full">
        <svg
          role="img"
          aria-label={summary}
          viewBox={`0 0 ${frame.width} ${frame.height}`}
          width={frame.width}
          height={frame.height}
          className="block h-auto max-w-full text-soil"
        >
          <text x={frame.left - 6} y={11} textAnchor="end" className="fill-stone text-[11px]">
            {units === 'us' ? 'in' : 'mm'}
          </text>
          {layout.ticks.map((t) => (
            <g key={t.value}>
              <line x1={frame.left} x2={frame.width - frame.right} y1={t.y} y2={t.y} className={t.value === 0 ? 'stroke-stone' : 'stroke-paper-200'} strokeWidth={1} />
              <text x={frame.left - 6} y={t.y + 4} textAnchor="end" className="fill-stone text-[12px] tabular-nums">
                {units === 'us' ? Number(t.value.toFixed(2)) : Number(t.value.toFixed(1))}
              </text>
            </g>
          ))}
          {layout.bars.map((b) => {
            const [day, month] = shortDate(b.weekStart).split(' ');
            return (
              <g key={b.weekStart}>
                <rect x={b.need.x} y={b.need.y} width={b.need.width} height={b.need.height} rx={2} className={NEED_FILL} />
                <rect x={b.rain.x} y={b.rain.y} width={b.rain.width} height={b.rain.height} rx={2} className={RAIN_FILL} />
                <text x={b.centre} y={layout.baseY + 15} textAnchor="middle" className="fill-soil text-[12px]">
                  <tspan x={b.centre}>{day}</tspan>
                  <tspan x={b.centre} dy={14}>
                    {month}
                  </tspan>
                </text>
              </g>
            );
          })}
        </svg>
      </div>
      <ul className="flex flex-wrap gap-x-6 gap-y-2 text-sm" aria-label="Legend">
        <li className="flex items-center gap-2">
          <span className="inline-block size-4 rounded-sm bg-clay" aria-hidden="true" />
          Need (left bar of each week)
        </li>
        <li className="flex items-center gap-2">
          <span className="inline-block size-4 rounded-sm bg-water" aria-hidden="true" />
          Rain logged (right bar)
        </li>
      </ul>
      <div className="overflow-x-auto rounded-xl border border-paper-200 bg-white" role="region" aria-label="The weeks as a table" tabIndex={0}>
        <table className="w-full min-w-[40rem] border-collapse text-left text-sm">
          <caption className="sr-only">Water need and rain logged per week</caption>
          <thead className="bg-paper-100">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">
                Week of
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Need
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Rain logged
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Deficit
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                To water
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                ET0 worked out by
              </th>
            </tr>
          </thead>
          <tbody>
            {data.weeks.map((w) => {
              const raw = byWeek.get(w.weekStart);
              return (
                <tr key={w.weekStart} className="border-t border-paper-200">
                  <th scope="row" className="px-3 py-2 font-medium whitespace-nowrap">
                    {taskDate(w.weekStart, today)}
                  </th>
                  <td className="px-3 py-2 whitespace-nowrap tabular-nums">{chartDepth(w.need, units)}</td>
                  <td className="px-3 py-2 whitespace-nowrap tabular-nums">{chartDepth(w.rain, units)}</td>
                  <td className="px-3 py-2 whitespace-nowrap tabular-nums">{raw ? formatDepth(Math.max(0, raw.deficitMm), units) : '–'}</td>
                  <td className="px-3 py-2 whitespace-nowrap tabular-nums">{raw ? formatVolume(raw.litres, units) : '–'}</td>
                  <td className="min-w-56 px-3 py-2">{w.methods}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
