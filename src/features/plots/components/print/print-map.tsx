import { useId } from 'react';
import { ArrowUp } from 'lucide-react';
import { footprint, lengthUnitLabel, METRES_PER_FOOT, type UnitSystem } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import { plotSeasonStatusLabels, type PlotSeasonState, type PlotSeasonStatus } from '@shared/schemas/seasons';
import type { Site } from '@shared/schemas/sites';
import { initials, niceScaleLength } from '../map/map-math';
import { rectOf } from '../map/map-canvas';

/** How a printed map names each plot's holder: initials, the full name, or not at all. */
export const holderNameModes = ['initials', 'full', 'none'] as const;
export type HolderNameMode = (typeof holderNameModes)[number];
export const holderNameLabels: Record<HolderNameMode, string> = {
  initials: 'Initials',
  full: 'Full name',
  none: 'No names',
};

/** The mode a `?names=` value asks for; initials when it is missing or not one of ours. */
export function readHolderNameMode(value: string | null): HolderNameMode {
  return holderNameModes.find((m) => m === value) ?? 'initials';
}

/** The second line printed on a plot: "Free", the holder (as chosen), "Offered", "Renewal?", "Club bed", or nothing. */
export function printedWord(plot: Pick<Plot, 'kind'>, state: PlotSeasonState | undefined, names: HolderNameMode): string | null {
  if (!state) return null;
  if (plot.kind === 'shared_bed' && state.status === 'free') return 'Club bed';
  if (state.status === 'free') return 'Free';
  if (state.status === 'offered') return 'Offered';
  if (state.status === 'renewal_pending') return 'Renewal?';
  const name = state.holder?.name;
  if (!name || names === 'none') return null;
  return names === 'full' ? name : initials(name);
}

/**
 * A scale bar for a drawing `siteWidthM` metres wide: a round length in the site's units (1, 2 or 5 × 10ⁿ)
 * about a quarter of the width, with that length in metres for drawing it.
 */
export function printScaleBar(siteWidthM: number, units: UnitSystem): { length: number; metres: number; text: string } {
  const metresPerUnit = units === 'us' ? METRES_PER_FOOT : 1;
  const length = niceScaleLength(metresPerUnit, Math.max(siteWidthM, 1) / 4);
  return { length, metres: length * metresPerUnit, text: `${length} ${lengthUnitLabel(units)}` };
}

// Fill says the status on screen and paper, and a word on each plot says it too (colour is never the only signal).
const statusFill: Record<Exclude<PlotSeasonStatus, 'free'>, string> = {
  taken: 'fill-shoot-100',
  offered: 'fill-straw',
  renewal_pending: 'fill-paper-200',
};

/** The outline says the kind: solid, thick for a raised bed, dashed for a container. */
function outline(kind: Plot['kind'], unit: number) {
  if (kind === 'raised_bed') return { strokeWidth: unit * 0.3 };
  if (kind === 'container') return { strokeWidth: unit * 0.12, strokeDasharray: `${unit * 0.5} ${unit * 0.3}` };
  return { strokeWidth: unit * 0.12 };
}

function FreeHatch({ id, size }: { id: string; size: number }) {
  return (
    <pattern id={id} patternUnits="userSpaceOnUse" width={size} height={size} patternTransform="rotate(45)">
      <rect width={size} height={size} className="fill-white" />
      <line x1={0} y1={0} x2={0} y2={size} className="stroke-stone" strokeWidth={size * 0.35} />
    </pattern>
  );
}

function Swatch({ fill, pattern, kind = 'in_ground' }: { fill?: string; pattern?: boolean; kind?: Plot['kind'] }) {
  const id = `${useId()}-swatch`;
  return (
    <svg viewBox="0 0 28 20" className="h-5 w-7 shrink-0" aria-hidden="true">
      {pattern && (
        <defs>
          <FreeHatch id={id} size={5} />
        </defs>
      )}
      <rect
        x={1}
        y={1}
        width={26}
        height={18}
        rx={1.5}
        fill={pattern ? `url(#${id})` : undefined}
        className={`${pattern ? '' : (fill ?? 'fill-white')} stroke-soil`}
        {...outline(kind, 10)}
      />
    </svg>
  );
}

/** What the printed map's fills, words and outlines mean. */
export function PrintMapLegend({ names, withSeason, seasonYear }: { names: HolderNameMode; withSeason: boolean; seasonYear?: number }) {
  const holderNote = names === 'full' ? ' (holder’s name)' : names === 'initials' ? ' (holder’s initials)' : '';
  return (
    <ul aria-label="Legend" className="flex flex-wrap gap-x-5 gap-y-1.5 text-sm text-soil">
      {withSeason && (
        <>
          <li className="flex items-center gap-2">
            <Swatch pattern />
            Free{seasonYear ? ` in ${seasonYear}` : ''} (hatched, marked “Free”)
          </li>
          <li className="flex items-center gap-2">
            <Swatch fill={statusFill.taken} />
            {plotSeasonStatusLabels.taken}
            {holderNote}
          </li>
          <li className="flex items-center gap-2">
            <Swatch fill={statusFill.offered} />
            {plotSeasonStatusLabels.offered} (marked “Offered”)
          </li>
          <li className="flex items-center gap-2">
            <Swatch fill={statusFill.renewal_pending} />
            {plotSeasonStatusLabels.renewal_pending} (marked “Renewal?”)
          </li>
          <li className="flex items-center gap-2">
            <Swatch fill="fill-white" kind="shared_bed" />
            Shared bed (marked “Club bed”)
          </li>
        </>
      )}
      <li className="flex items-center gap-2">
        <Swatch />
        In-ground plot (thin line)
      </li>
      <li className="flex items-center gap-2">
        <Swatch kind="raised_bed" />
        Raised bed (thick line)
      </li>
      <li className="flex items-center gap-2">
        <Swatch kind="container" />
        Container (dashed line)
      </li>
    </ul>
  );
}

export interface PrintMapProps {
  site: Pick<Site, 'name' | 'width' | 'length' | 'units'>;
  plots: Plot[];
  /** The season's state of each plot; empty before any season (then only the labels show). */
  states: PlotSeasonState[];
  names: HolderNameMode;
}

/**
 * The site drawn to scale as one SVG, in metres (north up, x east, y south as the map stores them):
 * each plot with its label and status word, free plots hatched and marked "Free", a scale bar in the
 * site's units and a north arrow under the site.
 */
export function PrintMap({ site, plots, states, names }: PrintMapProps) {
  const hatchId = `${useId()}-free`;
  const byPlot = new Map(states.map((s) => [s.plotId, s]));
  const W = Math.max(site.width, 1);
  const L = Math.max(site.length, 1);
  const unit = Math.max(W, L) / 60; // one "drawing unit": text, lines and gaps scale with the site
  const pad = unit * 1.5;
  const footer = unit * 5;
  const bar = printScaleBar(W, site.units);
  const textPx = unit * 1.6;

  return (
    <svg
      viewBox={`${-pad} ${-pad} ${W + 2 * pad} ${L + 2 * pad + footer}`}
      role="img"
      aria-label={`Map of ${site.name} to scale, ${plots.length} ${plots.length === 1 ? 'plot' : 'plots'}, north up`}
      data-testid="print-map"
      className="print-map h-[min(70vh,44rem)] w-full"
      fontFamily="inherit"
    >
      <defs>
        <FreeHatch id={hatchId} size={unit * 0.9} />
      </defs>
      <rect x={0} y={0} width={W} height={L} className="fill-paper stroke-soil" strokeWidth={unit * 0.15} />
      {plots.map((p) => {
        const fp = footprint(rectOf(p));
        const w = fp.maxX - fp.minX;
        const h = fp.maxY - fp.minY;
        const state = byPlot.get(p.id);
        const word = printedWord(p, state, names);
        const free = state?.status === 'free' && p.kind !== 'shared_bed';
        const lines = word ? 2 : 1;
        const longest = Math.max(p.label.length, word?.length ?? 0);
        // As large as the drawing's text, but small enough to fit inside the plot (about 0.62 em a character).
        const fs = Math.max(Math.min(textPx, (w * 0.9) / (longest * 0.62), (h * 0.8) / (lines * 1.25)), unit * 0.3);
        const cx = fp.minX + w / 2;
        const cy = fp.minY + h / 2;
        const fill = free ? `url(#${hatchId})` : undefined;
        const fillClass = free ? '' : state && state.status !== 'free' ? statusFill[state.status] : 'fill-white';
        return (
          <g key={p.id} data-plot={p.label} data-status={state?.status ?? 'none'}>
            <rect
              className={`plot-shape stroke-soil ${fillClass}`}
              x={fp.minX}
              y={fp.minY}
              width={w}
              height={h}
              rx={p.kind === 'container' ? Math.min(w, h) * 0.2 : unit * 0.1}
              fill={fill}
              {...outline(p.kind, unit)}
            />
            <text x={cx} y={cy} textAnchor="middle" dominantBaseline="middle" fontSize={fs} className="fill-soil">
              <tspan x={cx} dy={word ? -fs * 0.62 : 0} fontWeight={700} className="plot-label">
                {p.label}
              </tspan>
              {word && (
                <tspan x={cx} dy={fs * 1.25} className={`plot-word ${free ? 'font-semibold' : ''}`} paintOrder="stroke" stroke="white" strokeWidth={free ? fs * 0.25 : 0}>
                  {word}
                </tspan>
              )}
            </text>
          </g>
        );
      })}
      {/* Under the site: the scale bar on the left, north on the right. */}
      <g data-testid="scale-bar" data-metres={bar.metres} transform={`translate(0 ${L + unit * 2})`}>
        <path d={`M0 0 V${unit} H${bar.metres} V0`} fill="none" className="stroke-soil" strokeWidth={unit * 0.2} />
        <text x={bar.metres + unit * 0.8} y={unit * 0.9} fontSize={textPx} className="fill-soil">
          {bar.text}
        </text>
      </g>
      <g data-testid="north-arrow" transform={`translate(${W - unit * 3} ${L + unit * 0.8})`}>
        <ArrowUp x={0} y={0} width={unit * 2.4} height={unit * 2.4} className="text-soil" aria-hidden="true" />
        <text x={unit * 1.2} y={unit * 3.9} textAnchor="middle" fontSize={textPx} fontWeight={700} className="fill-soil">
          N
        </text>
      </g>
    </svg>
  );
}
