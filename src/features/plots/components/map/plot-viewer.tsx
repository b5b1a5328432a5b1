import { Crosshair, Minus, Plus } from 'lucide-react';
import { useCallback, useEffect, useId, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { footprint, type UnitSystem } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import { Button } from '@/components/ui/button';
import { useElementWidth } from '../../hooks/use-element-width';
import { kindClasses, MapBearings, plotBox, rectOf } from './map-canvas';

export interface PlotViewerProps {
  site: { name: string; width: number; length: number; units: UnitSystem };
  plots: Plot[];
  /** The reader's own plot: outlined, labelled "Your plot" and centred when the map opens. */
  yourPlotId: number;
}

interface View {
  zoom: number;
  x: number;
  y: number;
}

/** The map box's height in px (Tailwind h-80): tall enough to read, short enough to scroll past on a phone. */
const VIEW_HEIGHT = 320;
const MIN_ZOOM = 1;
const MAX_ZOOM = 12;
/** Zoom steps of the buttons and keys, and how far an arrow key pans (px). */
const ZOOM_STEP = 1.5;
const PAN_STEP = 40;
/** When the map opens, the reader's plot is drawn at least this many px on its short side (so its label reads). */
const READABLE_SIDE = 72;

const clampZoom = (z: number) => Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, z));

/**
 * A read-only site map for members: drag (mouse, pen or finger) to pan, pinch, wheel or the buttons
 * to zoom. The reader's plot is outlined and labelled in words, not only coloured.
 */
export function PlotViewer({ site, plots, yourPlotId }: PlotViewerProps) {
  const [boxRef, boxWidth] = useElementWidth<HTMLDivElement>();
  const box = useRef<HTMLDivElement | null>(null);
  const [view, setView] = useState<View | null>(null);
  const pointers = useRef(new Map<number, { x: number; y: number }>());
  const helpId = useId();
  const fit = boxWidth ? Math.min(boxWidth / site.width, VIEW_HEIGHT / site.length) : 0;
  const yours = plots.find((p) => p.id === yourPlotId) ?? null;

  /** The view that centres the reader's plot at a size where its label can be read (until the reader moves the map). */
  const home = useMemo((): View | null => {
    if (!fit) return null;
    if (!yours) return { zoom: 1, x: (boxWidth - site.width * fit) / 2, y: (VIEW_HEIGHT - site.length * fit) / 2 };
    const fp = footprint(rectOf(yours));
    const zoom = clampZoom(READABLE_SIDE / (Math.min(fp.maxX - fp.minX, fp.maxY - fp.minY) * fit));
    const s = fit * zoom;
    return { zoom, x: boxWidth / 2 - ((fp.minX + fp.maxX) / 2) * s, y: VIEW_HEIGHT / 2 - ((fp.minY + fp.maxY) / 2) * s };
  }, [fit, yours, boxWidth, site.width, site.length]);
  const shown = view ?? home;

  /** Zooms by `factor` keeping the point (cx, cy) of the box where it is. */
  const zoomAt = useCallback(
    (factor: number, cx: number, cy: number) =>
      setView((v) => {
        const from = v ?? home;
        if (!from) return v;
        const zoom = clampZoom(from.zoom * factor);
        const k = zoom / from.zoom;
        return { zoom, x: cx - (cx - from.x) * k, y: cy - (cy - from.y) * k };
      }),
    [home],
  );
  const panBy = (dx: number, dy: number) =>
    setView((v) => {
      const from = v ?? home;
      return from ? { ...from, x: from.x + dx, y: from.y + dy } : v;
    });

  // The wheel zooms the map instead of scrolling the page, so the listener cannot be passive.
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const r = el.getBoundingClientRect();
      zoomAt(Math.exp(-e.deltaY * 0.002), e.clientX - r.left, e.clientY - r.top);
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => el.removeEventListener('wheel', onWheel);
  }, [zoomAt]);

  const setBox = useCallback(
    (el: HTMLDivElement | null) => {
      box.current = el;
      boxRef(el);
    },
    [boxRef],
  );

  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    e.currentTarget.setPointerCapture(e.pointerId);
    pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    const was = pointers.current.get(e.pointerId);
    if (!was) return;
    const now = { x: e.clientX, y: e.clientY };
    const others = [...pointers.current.entries()].filter(([id]) => id !== e.pointerId).map(([, p]) => p);
    pointers.current.set(e.pointerId, now);
    if (others.length === 0) {
      panBy(now.x - was.x, now.y - was.y);
      return;
    }
    // Two fingers: zoom by how much their distance changed, about the point between them.
    const other = others[0]!;
    const before = Math.hypot(was.x - other.x, was.y - other.y);
    const after = Math.hypot(now.x - other.x, now.y - other.y);
    if (before < 1) return;
    const r = e.currentTarget.getBoundingClientRect();
    zoomAt(after / before, (now.x + other.x) / 2 - r.left, (now.y + other.y) / 2 - r.top);
  };
  const onPointerEnd = (e: PointerEvent<HTMLDivElement>) => {
    pointers.current.delete(e.pointerId);
  };

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const moves: Record<string, [number, number]> = { ArrowLeft: [PAN_STEP, 0], ArrowRight: [-PAN_STEP, 0], ArrowUp: [0, PAN_STEP], ArrowDown: [0, -PAN_STEP] };
    const move = moves[e.key];
    if (move) panBy(...move);
    else if (e.key === '+' || e.key === '=') zoomAt(ZOOM_STEP, boxWidth / 2, VIEW_HEIGHT / 2);
    else if (e.key === '-') zoomAt(1 / ZOOM_STEP, boxWidth / 2, VIEW_HEIGHT / 2);
    else return;
    e.preventDefault();
  };

  const scale = shown ? fit * shown.zoom : 0;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-2">
        <div className="flex items-center gap-1" role="group" aria-label="Zoom">
          <Button variant="secondary" aria-label="Zoom out" onClick={() => zoomAt(1 / ZOOM_STEP, boxWidth / 2, VIEW_HEIGHT / 2)}>
            <Minus className="size-5" aria-hidden="true" />
          </Button>
          <Button variant="secondary" aria-label="Zoom in" onClick={() => zoomAt(ZOOM_STEP, boxWidth / 2, VIEW_HEIGHT / 2)}>
            <Plus className="size-5" aria-hidden="true" />
          </Button>
        </div>
        <Button variant="secondary" onClick={() => setView(null)}>
          <Crosshair className="size-5" aria-hidden="true" /> Back to my plot
        </Button>
      </div>
      <p id={helpId} className="text-sm text-stone">
        Drag the map to move around it; pinch, scroll or use the buttons to zoom. With the keyboard: arrows move, + and − zoom.
      </p>
      <div
        ref={setBox}
        role="group"
        aria-label={`Map of ${site.name}${yours ? `, your plot ${yours.label} outlined` : ''}`}
        aria-describedby={helpId}
        tabIndex={0}
        onKeyDown={onKeyDown}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerEnd}
        onPointerCancel={onPointerEnd}
        className="relative h-80 cursor-grab touch-none overflow-hidden rounded-xl border border-paper-300 bg-paper-100 select-none active:cursor-grabbing"
        data-testid="plot-viewer"
      >
        {shown && (
          <div
            className="map-grid absolute top-0 left-0 border border-paper-300 bg-white"
            style={{ width: site.width * scale, height: site.length * scale, transform: `translate(${shown.x}px, ${shown.y}px)` }}
          >
            {plots.map((p) => {
              const { w, h, style } = plotBox(rectOf(p), scale);
              const mine = p.id === yourPlotId;
              const fontPx = Math.max(10, Math.min(16, Math.min(w, h) / 3));
              return (
                <div
                  key={p.id}
                  data-plot-label={p.label}
                  data-your-plot={mine || undefined}
                  aria-hidden={mine ? undefined : true}
                  className={`absolute flex items-center justify-center overflow-visible text-soil ${kindClasses[p.kind]} ${
                    mine ? 'z-10 bg-straw-100 outline-4 outline-offset-2 outline-water' : 'bg-white/85'
                  }`}
                  style={{ ...style, fontSize: fontPx }}
                >
                  {Math.min(w, h) >= 14 && <span className="max-w-full truncate px-0.5 leading-tight font-semibold">{p.label}</span>}
                  {mine && (
                    <span className="absolute bottom-full left-1/2 mb-2 -translate-x-1/2 rounded-md bg-water px-2 py-0.5 text-sm font-semibold whitespace-nowrap text-white shadow">
                      Your plot {p.label}
                    </span>
                  )}
                </div>
              );
            })}
          </div>
        )}
      </div>
      <MapBearings scale={scale} units={site.units} />
    </div>
  );
}
