import { useRef, useState, type PointerEvent as ReactPointerEvent } from 'react';
import { fromDisplayLength, lengthUnitLabel, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import type { PlotPart } from '@shared/schemas/plot-book';
import { Checkbox } from '@/components/ui/checkbox';
import { TextField } from '@/components/ui/field';
import { PlotDrawing, type DrawnPart } from './plot-drawing';

// Parts snap to 10 cm (common practice for marking out beds with a tape), and are at least that big.
const STEP = 0.1;
const snap = (m: number) => Math.round(m / STEP) * STEP;
const clamp = (v: number, lo: number, hi: number) => Math.min(Math.max(v, lo), hi);

export interface PartPickerProps {
  plot: { width: number; length: number; units: UnitSystem };
  value: PlotPart | null;
  onChange: (part: PlotPart | null) => void;
  /** Other plantings, drawn faintly so the new part can go beside them. */
  others: DrawnPart[];
  error?: string;
}

/**
 * Where on the plot: the whole plot, or a rectangle drawn with a finger or mouse on the plot's
 * drawing (snapped to 10 cm, kept inside the plot), or typed into the four boxes.
 */
export function PartPicker({ plot, value, onChange, others, error }: PartPickerProps) {
  const svg = useRef<SVGSVGElement>(null);
  const start = useRef<{ x: number; y: number } | null>(null);
  const [drafts, setDrafts] = useState<Record<keyof PlotPart, string> | null>(null);
  const units = plot.units;
  const unit = lengthUnitLabel(units);
  const show = (m: number) => String(roundTo(toDisplayLength(m, units), 2));

  const toPlot = (e: ReactPointerEvent<SVGSVGElement>) => {
    const el = svg.current!;
    const pt = el.createSVGPoint();
    pt.x = e.clientX;
    pt.y = e.clientY;
    const p = pt.matrixTransform(el.getScreenCTM()!.inverse());
    return { x: clamp(snap(p.x), 0, plot.width), y: clamp(snap(p.y), 0, plot.length) };
  };
  const rectFrom = (a: { x: number; y: number }, b: { x: number; y: number }): PlotPart => {
    const x = Math.min(a.x, b.x);
    const y = Math.min(a.y, b.y);
    const width = Math.max(Math.abs(a.x - b.x), STEP);
    const length = Math.max(Math.abs(a.y - b.y), STEP);
    return {
      x: roundTo(Math.min(x, plot.width - width), 3),
      y: roundTo(Math.min(y, plot.length - length), 3),
      width: roundTo(Math.min(width, plot.width), 3),
      length: roundTo(Math.min(length, plot.length), 3),
    };
  };

  const down = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (e.button !== 0) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    start.current = toPlot(e);
    setDrafts(null);
    onChange(rectFrom(start.current, start.current));
  };
  const move = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (start.current) onChange(rectFrom(start.current, toPlot(e)));
  };
  const up = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (!start.current) return;
    onChange(rectFrom(start.current, toPlot(e)));
    start.current = null;
  };

  const field = (key: keyof PlotPart, label: string) => (
    <TextField
      label={`${label} (${unit})`}
      inputMode="decimal"
      value={drafts?.[key] ?? (value ? show(value[key]) : '')}
      onChange={(e) => {
        const text = e.target.value;
        const next = { ...(drafts ?? { x: show(value!.x), y: show(value!.y), width: show(value!.width), length: show(value!.length) }), [key]: text };
        setDrafts(next);
        const n = Number(text.replace(',', '.'));
        if (text.trim() !== '' && Number.isFinite(n)) onChange({ ...value!, [key]: roundTo(fromDisplayLength(n, units), 3) });
      }}
    />
  );

  return (
    <fieldset className="flex flex-col gap-3" aria-describedby={error ? 'part-error' : undefined}>
      <legend className="mb-1 font-medium">Where on the plot</legend>
      <Checkbox
        label="The whole plot"
        checked={value === null}
        onChange={(e) => {
          setDrafts(null);
          onChange(e.target.checked ? null : { x: 0, y: 0, width: roundTo(plot.width / 2, 3), length: roundTo(plot.length / 2, 3) });
        }}
      />
      {value !== null && (
        <>
          <p className="text-sm text-stone">Drag across the plot to mark the part, or type its size and place. North is up, as on the map.</p>
          <PlotDrawing
            svgRef={svg}
            interactive
            width={plot.width}
            length={plot.length}
            title={`Plot drawing: the part marked is ${show(value.width)} × ${show(value.length)} ${unit}`}
            parts={[...others, { id: 'new', part: value, label: 'New', emphasis: true }]}
            onPointerDown={down}
            onPointerMove={move}
            onPointerUp={up}
          />
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            {field('width', 'Width')}
            {field('length', 'Length')}
            {field('x', 'From the left')}
            {field('y', 'From the top')}
          </div>
        </>
      )}
      {error && (
        <p id="part-error" className="text-sm font-medium text-clay-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
