import type { PointerEvent as ReactPointerEvent, ReactNode } from 'react';
import type { PlotPart } from '@shared/schemas/plot-book';
import { palette } from '@/lib/palette';

export interface DrawnPart {
  id: number | string;
  part: PlotPart | null;
  label: string;
  /** Drawn stronger, e.g. the planting being edited. */
  emphasis?: boolean;
}

// Leaf greens and straw from the palette, alternating so neighbouring parts stay apart; text says the rest.
const fills = [palette.bed[1], palette.bed[2], palette.bed[3], palette.bed[4]];

export interface PlotDrawingProps {
  width: number;
  length: number;
  parts: DrawnPart[];
  /** Accessible description of what the drawing shows. */
  title: string;
  children?: ReactNode;
  onPointerDown?: (e: ReactPointerEvent<SVGSVGElement>) => void;
  onPointerMove?: (e: ReactPointerEvent<SVGSVGElement>) => void;
  onPointerUp?: (e: ReactPointerEvent<SVGSVGElement>) => void;
  svgRef?: React.Ref<SVGSVGElement>;
  interactive?: boolean;
}

/**
 * A plot drawn to scale in its own metres (x across, y down, north up as on the map) with each
 * planting's part as a labelled rectangle; the whole plot when a planting has no part.
 */
export function PlotDrawing({ width, length, parts, title, children, onPointerDown, onPointerMove, onPointerUp, svgRef, interactive = false }: PlotDrawingProps) {
  const pad = Math.max(width, length) * 0.03;
  const font = Math.max(Math.min(width, length) * 0.09, 0.08);
  return (
    <svg
      ref={svgRef}
      role="img"
      aria-label={title}
      viewBox={`${-pad} ${-pad} ${width + 2 * pad} ${length + 2 * pad}`}
      className={`block max-h-[60vh] w-full rounded-lg bg-paper-100 ${interactive ? 'cursor-crosshair touch-none select-none' : ''}`}
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={onPointerUp}
    >
      <rect x={0} y={0} width={width} height={length} fill={palette.bed.ground} stroke={palette.soil.DEFAULT} strokeWidth={Math.max(width, length) * 0.008} />
      {parts.map((p, i) => {
        const r = p.part ?? { x: 0, y: 0, width, length };
        return (
          <g key={p.id}>
            <rect
              x={r.x}
              y={r.y}
              width={r.width}
              height={r.length}
              fill={fills[i % fills.length]}
              stroke={p.emphasis ? palette.leaf.DEFAULT : palette.stone.DEFAULT}
              strokeWidth={Math.max(width, length) * (p.emphasis ? 0.012 : 0.005)}
              strokeDasharray={p.part ? undefined : `${font / 2} ${font / 3}`}
            />
            <text
              x={r.x + r.width / 2}
              y={r.y + r.length / 2}
              fontSize={Math.min(font, r.width / Math.max(p.label.length * 0.6, 1))}
              textAnchor="middle"
              dominantBaseline="middle"
              fill={palette.soil.DEFAULT}
            >
              {p.label}
            </text>
          </g>
        );
      })}
      {children}
    </svg>
  );
}
