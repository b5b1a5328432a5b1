import { useDraggable } from '@dnd-kit/core';
import { Accessibility, Droplet } from 'lucide-react';
import type { KeyboardEvent } from 'react';
import { footprint, type Rect } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import type { PlotSeasonState } from '@shared/schemas/seasons';
import { plotName, statusClasses, statusWord } from './season-status';

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
  const small = Math.min(w, h) < 34;
  const fontPx = Math.max(10, Math.min(15, Math.min(w, h) / 3));
  const who = season?.holder?.name ?? season?.offer?.name ?? season?.renewal?.name ?? null;
  return (
    <div
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      role="button"
      aria-roledescription={canEdit ? 'movable plot' : 'plot'}
      aria-describedby={describedBy}
      aria-label={plotName(plot.label, season?.status ?? null, who, plot.kind)}
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
      style={{ left: fp.minX * scale, top: fp.minY * scale, width: w, height: h, fontSize: fontPx }}
      title={plot.label}
    >
      <span className="max-w-full truncate px-0.5 leading-tight font-semibold">{plot.label}</span>{' '}
      {season && !small && <span className="max-w-full truncate px-0.5 text-[0.85em] leading-tight">{statusWord(season.status, who, plot.kind)}</span>}
      {!small && (plot.isAccessible || plot.hasWaterTap) && (
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
