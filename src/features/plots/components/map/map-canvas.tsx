import { Accessibility, Droplet } from 'lucide-react';
import { Fragment, type CSSProperties, type HTMLAttributes, type KeyboardEventHandler, type ReactNode, type Ref } from 'react';
import { footprint, type Rect, type UnitSystem } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import type { PlotSeasonStatus } from '@shared/schemas/seasons';
import type { Site } from '@shared/schemas/sites';
import { useElementWidth } from '../../hooks/use-element-width';
import { ScaleBar } from './scale-bar';
import { plotName, statusClasses, statusWord } from './season-status';
import { fitTileText } from './tile-text';

/*
 * The one drawing of a site map, shared by the editor (drag and resize), the spring round's
 * season map (drag a person onto a plot) and whatever is laid over them (the neighbour check):
 * the frame that scrolls, the site to scale on its grid, the background plan, each plot's
 * tile, and the scale bar with north. Each map brings its own behaviour through the plot it
 * renders and the children it draws on top.
 */

/** The plain facts of a plot for a layer drawn over the map: where it is and what it is called. */
export interface MapPlotView {
  plot: Plot;
  rect: Rect;
}

/**
 * Something drawn over a map by a page that composes it (a feature the map does not know):
 * `marks` goes inside the canvas above the plots, in the canvas's pixels (`width` is the
 * canvas's, for marks placed from its right edge); `controls` above the
 * map; `panel` beside it; `legend` under the map's own legend.
 */
export interface MapOverlay {
  marks?(view: { plots: MapPlotView[]; scale: number; width: number }): ReactNode;
  controls?: ReactNode;
  panel?: ReactNode;
  legend?: ReactNode;
}

export const rectOf = (p: Plot): Rect => ({ x: p.x, y: p.y, width: p.width, length: p.length, rotation: p.rotation });

// Kind is told by outline shape, never by colour alone.
export const kindClasses: Record<Plot['kind'], string> = {
  in_ground: 'rounded-sm border-2 border-soil/70',
  raised_bed: 'rounded-md border-[5px] border-double border-soil/80',
  container: 'rounded-2xl border-2 border-dashed border-soil/80',
  shared_bed: 'rounded-sm border-2 border-soil/70 plot-hatch',
};

/** The border width of each kind's outline in pixels (as in kindClasses), which the text must clear. */
const kindBorderPx: Record<Plot['kind'], number> = { in_ground: 2, raised_bed: 5, container: 2, shared_bed: 2 };

/** The smallest text drawn on a plot, in pixels; anything smaller goes to the map's key instead. */
export const TILE_MIN_PX = 9;

/** Where a plot's label and status word go on its tile, or that they do not fit (the key then names it). */
export function tileText(plot: Pick<Plot, 'label' | 'kind'>, word: string | null, w: number, h: number, maxPx: number) {
  const border = kindBorderPx[plot.kind];
  return fitTileText(plot.label, word, w - 2 * border - 2, h - 2 * border, TILE_MIN_PX, maxPx);
}

/** Whether a plot at this size shows its label (and status word, when it has one) on its tile. */
export function shownOnTile(plot: Pick<Plot, 'label' | 'kind'>, rect: Rect, scale: number, word: string | null, maxPx: number): boolean {
  const fp = footprint(rect);
  const { layout } = tileText(plot, word, (fp.maxX - fp.minX) * scale, (fp.maxY - fp.minY) * scale, maxPx);
  return layout === 'stack' || layout === 'line' || (layout === 'label' && !word);
}

/** The plots too small at this scale to show their label and word, for the map's key (SmallPlotsKey). */
export function tooSmallToLabel(plots: Plot[], scale: number, maxPx: number, wordOf: (p: Plot) => string | null) {
  return plots.flatMap((p) => {
    const word = wordOf(p);
    return shownOnTile(p, rectOf(p), scale, word, maxPx) ? [] : [{ label: p.label, word }];
  });
}

/** The label and status word inside a tile, laid out as tileText decided; never cut off with an ellipsis. */
export function TileText({ label, word, layout }: { label: string; word: string | null; layout: ReturnType<typeof tileText>['layout'] }) {
  if (layout === 'none') return null;
  if (layout === 'line') {
    return (
      <span className="leading-tight whitespace-nowrap">
        <span className="font-semibold">{label}</span> {word}
      </span>
    );
  }
  return (
    <>
      <span className="leading-tight font-semibold whitespace-nowrap">{label}</span>{' '}
      {layout === 'stack' && <span className="leading-tight whitespace-nowrap">{word}</span>}
    </>
  );
}

/**
 * Pixels per metre for a map that fills its frame: a callback ref for the frame and the scale.
 * `fallbackFit` (px per m) is used before the frame is measured; `zoom` multiplies the fit, and
 * the result stays within 2 px/m and `maxScale`.
 */
export function useMapScale(siteWidth: number, { zoom = 1, maxScale = Infinity, fallbackFit }: { zoom?: number; maxScale?: number; fallbackFit: number }) {
  const [frameRef, frameWidth] = useElementWidth<HTMLDivElement>();
  // The frame's 1 px border on each side is not map.
  const fit = frameWidth ? (frameWidth - 2) / siteWidth : fallbackFit;
  const scale = Math.min(maxScale, Math.max(2, fit * zoom));
  return [frameRef, scale] as const;
}

/** The spacing of the drawn grid lines in px: the site's grid, or every tenth line when the grid is finer than 6 px. */
export function gridLinePx(grid: number, scale: number): number {
  const step = (grid > 0 ? grid : 0.1) * scale;
  return step < 6 ? step * 10 : step;
}

/** Where a footprint sits on the canvas, in px. */
export function plotBox(rect: Rect, scale: number) {
  const fp = footprint(rect);
  const w = (fp.maxX - fp.minX) * scale;
  const h = (fp.maxY - fp.minY) * scale;
  return { w, h, style: { left: fp.minX * scale, top: fp.minY * scale, width: w, height: h } satisfies CSSProperties };
}

export interface MapCanvasProps {
  site: Pick<Site, 'name' | 'width' | 'length' | 'grid' | 'background'>;
  scale: number;
  /** The frame's ref, from useMapScale, so the map fits the frame. */
  frameRef: Ref<HTMLDivElement>;
  /** The accessible name of the drawn map (tests and screen readers find the map by it). */
  label: string;
  plots: Plot[];
  /** Draws one plot; PlotTileView keeps every map's plots alike. */
  renderPlot(plot: Plot): ReactNode;
  /** Drawn above the plots in the canvas's pixels: a resize grip, an overlay's marks. */
  children?: ReactNode;
  onKeyDown?: KeyboardEventHandler<HTMLDivElement>;
}

/** The site to scale in a frame that scrolls: grid, background plan, the plots and what lies over them. */
export function MapCanvas({ site, scale, frameRef, label, plots, renderPlot, children, onKeyDown }: MapCanvasProps) {
  return (
    // The frame only hears keys pressed on the plots inside it (the editor's Ctrl+Z); it is not a control itself.
    <div ref={frameRef} className="overflow-auto rounded-xl border border-paper-300 bg-white" onKeyDown={onKeyDown}>
      <div
        className="map-grid relative"
        style={{ width: site.width * scale, height: site.length * scale, ['--grid-px' as string]: `${gridLinePx(site.grid, scale)}px` }}
        role="group"
        aria-label={label}
      >
        {site.background?.metresPerPixel && (
          <img
            src={site.background.url}
            alt=""
            className="pointer-events-none absolute top-0 left-0 opacity-50 select-none"
            style={{ width: site.background.widthPx * site.background.metresPerPixel * scale }}
          />
        )}
        {plots.map((p) => (
          <Fragment key={p.id}>{renderPlot(p)}</Fragment>
        ))}
        {children}
      </div>
    </div>
  );
}

/** Every plot of a map with its drawn place, for an overlay (the saved place; a drag in progress is not shown to overlays). */
export function plotViews(plots: Plot[]): MapPlotView[] {
  return plots.map((plot) => ({ plot, rect: rectOf(plot) }));
}

type TileElementProps = Omit<HTMLAttributes<HTMLElement>, 'className' | 'style' | 'title' | 'aria-label'>;

export interface PlotTileViewProps extends TileElementProps {
  /** A div for the editor's draggable plot, a button for a plot one clicks or drops onto. */
  as: 'div' | 'button';
  ref?: Ref<HTMLElement>;
  plot: Plot;
  /** Where to draw it (the saved place, or where a drag would put it). */
  rect: Rect;
  scale: number;
  /** The plot's season status, or null when no season is shown (then the tile is plain). */
  status: PlotSeasonStatus | null;
  /** Who the status is about (holder, offered to, renewing). */
  who: string | null;
  /** The largest label size in px. */
  maxPx: number;
  /** Shows the wheelchair and water-tap marks when the tile has room for them. */
  icons?: boolean;
  /** The map's own classes: marks, cursor, drop highlight. */
  className?: string;
  type?: 'button';
  children?: ReactNode;
}

/** One plot's tile as every map draws it: to scale, outline by kind, fill and word by status, label fitted or left to the key. */
export function PlotTileView({ as, ref, plot, rect, scale, status, who, maxPx, icons = false, className = '', children, ...rest }: PlotTileViewProps) {
  const { w, h, style } = plotBox(rect, scale);
  const word = status ? statusWord(status, who, plot.kind) : null;
  const text = tileText(plot, word, w, h, maxPx);
  const name = plotName(plot.label, status, who, plot.kind);
  const roomy = text.layout === 'stack' && h >= 2.5 * text.px + 26;
  const Element = as;
  return (
    <Element
      ref={ref as Ref<HTMLDivElement & HTMLButtonElement>}
      {...rest}
      aria-label={name}
      title={name}
      data-plot-label={plot.label}
      className={`absolute flex flex-col items-center justify-center overflow-hidden text-soil ${status ? statusClasses[status] : 'bg-white/85'} ${kindClasses[plot.kind]} ${className}`}
      style={{ ...style, fontSize: text.px }}
    >
      <TileText label={plot.label} word={word} layout={text.layout} />
      {icons && roomy && (plot.isAccessible || plot.hasWaterTap) && (
        <span className="mt-0.5 flex gap-0.5 text-water-700" aria-hidden="true">
          {plot.isAccessible && <Accessibility className="size-3.5" />}
          {plot.hasWaterTap && <Droplet className="size-3.5" />}
        </span>
      )}
      {children}
    </Element>
  );
}

/** The scale bar and which way is north, under every map. */
export function MapBearings({ scale, units }: { scale: number; units: UnitSystem }) {
  return (
    <div className="flex flex-wrap items-end gap-4">
      {scale > 0 && <ScaleBar scale={scale} units={units} />}
      <span className="text-sm font-medium text-stone">North is up ↑</span>
    </div>
  );
}
