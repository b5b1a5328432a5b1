import { zodResolver } from '@hookform/resolvers/zod';
import { ExternalLink, RotateCw, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { formatArea, formatLength, fromDisplayLength, lengthUnitLabel, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import {
  PlotCreateBodySchema,
  plotKindLabels,
  plotKinds,
  sunLabels,
  sunValues,
  type Plot,
  type PlotCreateBody,
} from '@shared/schemas/plots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';

const numberText = z
  .string()
  .trim()
  .min(1, 'Enter a number')
  .refine((v) => Number.isFinite(Number(v)), 'Enter a number');
const optionalNumberText = z
  .string()
  .trim()
  .refine((v) => v === '' || Number.isFinite(Number(v)), 'Enter a number or leave it empty');

/** The inspector's form holds text in the site's units; it becomes a plot body in metres, checked by the shared schema. */
function formSchema(units: UnitSystem) {
  const len = (v: string) => roundTo(fromDisplayLength(Number(v), units), 3);
  return z
    .object({
      label: z.string(),
      x: numberText,
      y: numberText,
      width: numberText,
      length: numberText,
      rotation: z.enum(['0', '90']),
      kind: z.enum(plotKinds),
      sun: z.enum(sunValues),
      soilDepth: optionalNumberText,
      soilPh: optionalNumberText,
      isAccessible: z.boolean(),
      hasWaterTap: z.boolean(),
      notes: z.string(),
    })
    .transform((v, ctx) => {
      const body = {
      label: v.label,
      x: len(v.x),
      y: len(v.y),
      width: len(v.width),
      length: len(v.length),
      rotation: Number(v.rotation) as 0 | 90,
      kind: v.kind,
      sun: v.sun,
      soilDepth: v.soilDepth === '' ? null : len(v.soilDepth),
      soilPh: v.soilPh === '' ? null : Number(v.soilPh),
      isAccessible: v.isAccessible,
      hasWaterTap: v.hasWaterTap,
      notes: v.notes,
      };
      // The shared schema decides what a valid plot is; its messages land on the matching inputs.
      const checked = PlotCreateBodySchema.omit({ soilTestedOn: true }).safeParse(body);
      if (checked.success) return checked.data;
      for (const issue of checked.error.issues) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
      return z.NEVER;
    });
}
type FormInput = z.input<ReturnType<typeof formSchema>>;

function toForm(p: Plot, units: UnitSystem): FormInput {
  const d = (m: number) => String(roundTo(toDisplayLength(m, units), 2));
  return {
    label: p.label,
    x: d(p.x),
    y: d(p.y),
    width: d(p.width),
    length: d(p.length),
    rotation: String(p.rotation) as '0' | '90',
    kind: p.kind,
    sun: p.sun,
    soilDepth: p.soilDepth === null ? '' : d(p.soilDepth),
    soilPh: p.soilPh === null ? '' : String(p.soilPh),
    isAccessible: p.isAccessible,
    hasWaterTap: p.hasWaterTap,
    notes: p.notes,
  };
}

export interface PlotInspectorProps {
  plot: Plot;
  units: UnitSystem;
  canEdit: boolean;
  neighbours: Array<{ plotId: number; label: string; side: string; kind: string; gap: number }>;
  plotHref: string;
  onSave(changes: Partial<PlotCreateBody>): Promise<unknown>;
  onDelete(): Promise<unknown>;
  onRotate(): void;
}

const FIELD_NAMES = ['label', 'x', 'y', 'width', 'length', 'rotation', 'kind', 'sun', 'soilDepth', 'soilPh', 'notes'] as const;

/**
 * The selected plot's details: exact position and size, kind, soil and notes, with save and remove.
 * The parent keys it by plot id and version, so a new selection or the server's newer copy starts it afresh.
 */
export function PlotInspector({ plot, units, canEdit, neighbours, plotHref, onSave, onDelete, onRotate }: PlotInspectorProps) {
  const schema = formSchema(units);
  const { register, handleSubmit, setError, formState } = useForm<FormInput, unknown, z.output<typeof schema>>({
    resolver: zodResolver(schema),
    defaultValues: toForm(plot, units),
  });
  const [alert, setAlert] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const u = lengthUnitLabel(units);

  const submit = handleSubmit(async (values) => {
    const changes: Partial<PlotCreateBody> = {};
    for (const [k, v] of Object.entries(values) as Array<[keyof PlotCreateBody, unknown]>) {
      if ((plot as Record<string, unknown>)[k] !== v) (changes as Record<string, unknown>)[k] = v;
    }
    if (Object.keys(changes).length === 0) return;
    try {
      await onSave(changes);
      setAlert(null);
    } catch (err) {
      setAlert(applyServerErrors(err, setError, FIELD_NAMES));
    }
  });

  const e = formState.errors;
  return (
    <section aria-labelledby="inspector-title" className="space-y-4">
      <div className="flex items-start justify-between gap-3">
        <div>
          <h2 id="inspector-title" className="text-xl font-semibold">
            Plot {plot.label}
          </h2>
          <p className="text-stone">
            {plotKindLabels[plot.kind]} · {formatLength(plot.width, units)} × {formatLength(plot.length, units)} ·{' '}
            {formatArea(plot.area, units)}
          </p>
        </div>
        <div className="flex flex-col items-end">
          <Link to={plotHref} className="inline-flex min-h-11 items-center gap-1 font-medium">
            Plot page <ExternalLink className="size-4" aria-hidden="true" />
          </Link>
          {plot.kind !== 'shared_bed' && (
            <Link to={`${plotHref}/book`} className="inline-flex min-h-11 items-center gap-1 font-medium">
              Plot book <ExternalLink className="size-4" aria-hidden="true" />
            </Link>
          )}
        </div>
      </div>

      <div>
        <h3 className="font-semibold">Neighbours</h3>
        {neighbours.length === 0 ? (
          <p className="text-stone">None within the path width.</p>
        ) : (
          <ul className="mt-1 space-y-0.5">
            {neighbours.map((n) => (
              <li key={n.plotId}>
                <span className="font-medium">{n.label}</span>{' '}
                <span className="text-stone">
                  to the {n.side}, {n.kind === 'touching' ? 'touching' : `across ${formatLength(n.gap, units)} of path`}
                </span>
              </li>
            ))}
          </ul>
        )}
      </div>

      {canEdit && (
        <form onSubmit={submit} noValidate className="space-y-3">
          {alert && <Alert tone="error">{alert}</Alert>}
          <TextField label="Label" {...register('label')} error={e.label?.message} />
          <div className="grid grid-cols-2 gap-3">
            <TextField label={`From west edge (${u})`} inputMode="decimal" {...register('x')} error={e.x?.message} />
            <TextField label={`From north edge (${u})`} inputMode="decimal" {...register('y')} error={e.y?.message} />
            <TextField label={`Width (${u})`} inputMode="decimal" {...register('width')} error={e.width?.message} />
            <TextField label={`Length (${u})`} inputMode="decimal" {...register('length')} error={e.length?.message} />
          </div>
          {/* One select a row: the option words are too long for half the panel. */}
          <div className="grid grid-cols-1 gap-3">
            <Select label="Turned" {...register('rotation')} error={e.rotation?.message}>
              <option value="0">Length north–south</option>
              <option value="90">Length east–west</option>
            </Select>
            <Select label="Kind" {...register('kind')} error={e.kind?.message}>
              {plotKinds.map((k) => (
                <option key={k} value={k}>
                  {plotKindLabels[k]}
                </option>
              ))}
            </Select>
            <Select label="Sun" {...register('sun')}>
              {sunValues.map((s) => (
                <option key={s} value={s}>
                  {sunLabels[s]}
                </option>
              ))}
            </Select>
          </div>
          <div className="grid grid-cols-2 gap-3">
            <TextField label={`Soil depth (${u})`} hint="Raised beds and containers" inputMode="decimal" {...register('soilDepth')} error={e.soilDepth?.message} />
            <TextField label="Soil pH" hint="From the latest soil test" inputMode="decimal" {...register('soilPh')} error={e.soilPh?.message} />
          </div>
          <Checkbox label="At wheelchair height" {...register('isAccessible')} />
          <Checkbox label="Water tap nearby" {...register('hasWaterTap')} />
          <TextField label="Notes" {...register('notes')} error={e.notes?.message} />
          <div className="flex flex-wrap gap-2 pt-1">
            <Button type="submit" loading={formState.isSubmitting} loadingText="Saving…">
              Save plot
            </Button>
            <Button type="button" variant="secondary" onClick={onRotate}>
              <RotateCw className="size-5" aria-hidden="true" /> Turn
            </Button>
            {confirming ? (
              <>
                <Button type="button" variant="danger" onClick={() => void onDelete()}>
                  Yes, remove {plot.label}
                </Button>
                <Button type="button" variant="ghost" onClick={() => setConfirming(false)}>
                  Keep it
                </Button>
              </>
            ) : (
              <Button type="button" variant="ghost" onClick={() => setConfirming(true)}>
                <Trash2 className="size-5" aria-hidden="true" /> Remove
              </Button>
            )}
          </div>
        </form>
      )}
    </section>
  );
}
