import { useDraggable } from '@dnd-kit/core';
import type { KeyboardEvent } from 'react';
import { footprint, type Rect } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import type { PlotSeasonState } from '@shared/schemas/seasons';
import { PlotTileView } from './map-canvas';
import { seasonPerson } from './season-status';

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

const markClasses: Record<Exclude<PlotMark, null>, string> = {
  selected: 'ring-4 ring-leaf z-20',
  neighbour: 'outline-3 outline-dashed outline-water outline-offset-1 z-10',
  blocked: 'ring-4 ring-clay z-20',
};

/** One plot on the editor's map, drawn as every map draws it; drag it to move it (pointer or keyboard). */
export function PlotShape({ plot, rect, scale, mark, canEdit, onSelect, onBlur, onKeyCommand, describedBy, season }: PlotShapeProps) {
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({ id: `move:${plot.id}`, disabled: !canEdit });
  return (
    <PlotTileView
      as="div"
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      plot={plot}
      rect={rect}
      scale={scale}
      status={season?.status ?? null}
      who={seasonPerson(season)}
      maxPx={15}
      icons
      role="button"
      aria-roledescription={canEdit ? 'movable plot' : 'plot'}
      aria-describedby={describedBy}
      aria-pressed={mark === 'selected'}
      tabIndex={0}
      onClick={onSelect}
      onFocus={onSelect}
      onBlur={onBlur}
      onKeyDown={(e) => {
        onKeyCommand(e);
      }}
      className={`select-none ${mark ? markClasses[mark] : ''} ${canEdit ? 'cursor-grab touch-none' : 'cursor-pointer'} ${isDragging ? 'cursor-grabbing opacity-90 shadow-lg' : ''}`}
    />
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
