import { useDraggable } from '@dnd-kit/core';
import { Accessibility, Droplet } from 'lucide-react';
import type { KeyboardEvent } from 'react';
import { footprint, type Rect } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import type { PlotSeasonState } from '@shared/schemas/seasons';
import { plotName, statusClasses, statusWord } from './season-status';
import { fitTileText } from './tile-text';

export type PlotMark = 'selected' | 'neighbour' | 'blocked' | null;

export interface PlotShapeProps {
  plot: Plot;
  /** Where to draw it (the saved place, or where a drag would put it). */
  rect: Rect;
  scale: number;
  mark: PlotMark;
  canEdit: boolean;
  onSelect(): void;
  onBlur(): void;
  onKeyCommand(e: KeyboardEvent<HTMLElement>): boolean;
  describedBy: string;
  /** This season's status and holder, when a season is open. */
  season?: PlotSeasonState;
}

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

const markClasses: Record<Exclude<PlotMark, null>, string> = {
  selected: 'ring-4 ring-leaf z-20',
  neighbour: 'outline-3 outline-dashed outline-water outline-offset-1 z-10',
  blocked: 'ring-4 ring-clay z-20',
};

/** One plot on the map, drawn to scale; drag it to move it (pointer or keyboard). */
export function PlotShape({ plot, rect, scale, mark, canEdit, onSelect, onBlur, onKeyCommand, describedBy, season }: PlotShapeProps) {
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({ id: `move:${plot.id}`, disabled: !canEdit });
  const fp = footprint(rect);
  const w = (fp.maxX - fp.minX) * scale;
  const h = (fp.maxY - fp.minY) * scale;
  const who = season?.holder?.name ?? season?.offer?.name ?? season?.renewal?.name ?? null;
  const word = season ? statusWord(season.status, who, plot.kind) : null;
  const text = tileText(plot, word, w, h, 15);
  const name = plotName(plot.label, season?.status ?? null, who, plot.kind);
  const roomy = text.layout === 'stack' && h >= 2.5 * text.px + 26;
  return (
    <div
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      role="button"
      aria-roledescription={canEdit ? 'movable plot' : 'plot'}
      aria-describedby={describedBy}
      aria-label={name}
      aria-pressed={mark === 'selected'}
      data-plot-label={plot.label}
      tabIndex={0}
      onClick={onSelect}
      onFocus={onSelect}
      onBlur={onBlur}
      onKeyDown={(e) => {
        onKeyCommand(e);
      }}
      className={`absolute flex flex-col items-center justify-center overflow-hidden text-soil select-none ${season ? statusClasses[season.status] : 'bg-white/85'} ${
        kindClasses[plot.kind]
      } ${mark ? markClasses[mark] : ''} ${canEdit ? 'cursor-grab touch-none' : 'cursor-pointer'} ${isDragging ? 'cursor-grabbing opacity-90 shadow-lg' : ''}`}
      style={{ left: fp.minX * scale, top: fp.minY * scale, width: w, height: h, fontSize: text.px }}
      title={name}
    >
      <TileText label={plot.label} word={word} layout={text.layout} />
      {roomy && (plot.isAccessible || plot.hasWaterTap) && (
        <span className="mt-0.5 flex gap-0.5 text-water-700" aria-hidden="true">
          {plot.isAccessible && <Accessibility className="size-3.5" />}
          {plot.hasWaterTap && <Droplet className="size-3.5" />}
        </span>
      )}
    </div>
  );
}

/** The corner grip that resizes the selected plot. */
export function ResizeHandle({ plot, rect, scale }: { plot: Plot; rect: Rect; scale: number }) {
  const { attributes, listeners, setNodeRef } = useDraggable({ id: `resize:${plot.id}` });
  const fp = footprint(rect);
  return (
    <div
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      role="button"
      aria-label={`Resize plot ${plot.label}`}
      className="absolute z-30 size-6 -translate-x-1/2 -translate-y-1/2 cursor-nwse-resize touch-none rounded-full border-2 border-white bg-leaf shadow"
      style={{ left: fp.maxX * scale, top: fp.maxY * scale }}
    />
  );
}
