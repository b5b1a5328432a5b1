import { useEffect, useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { localToday } from '@shared/dates';
import type { UnitSystem } from '@shared/geometry';
import { plantingStatuses, type Planting, type PlotPart } from '@shared/schemas/plot-book';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useTimeZone } from '@/lib/time-zone';
import { useCropOptions } from '../api/get-crop-options';
import { useCreatePlanting } from '../api/create-planting';
import { draftFromForm } from '../lib/check-draft';
import { statusWords } from '../lib/format';
import type { NeighbourCheckSlots } from './neighbour-check-slots';
import { PartPicker } from './part-picker';
import type { DrawnPart } from './plot-drawing';

const wholeNumber = (what: string) =>
  z
    .string()
    .trim()
    .refine((v) => v === '' || /^\d+$/.test(v), `A whole number of ${what}`)
    .transform((v) => (v === '' ? null : Number(v)));

const FormSchema = z.object({
  cropId: z.string().min(1, 'Choose a crop').transform(Number),
  variety: z.string().max(120, 'At most 120 characters'),
  method: z.enum(['sown', 'transplanted']),
  plantedOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Choose the date'),
  layout: z.enum(['rows', 'intensive']),
  rowCount: wholeNumber('rows'),
  quantity: wholeNumber('plants'),
  status: z.enum(plantingStatuses),
  notes: z.string().max(2000, 'At most 2000 characters'),
  // Needed only when the neighbour check finds a clash; the submit handler says so.
  keepReason: z.string().max(500, 'At most 500 characters'),
});
type FormInput = z.input<typeof FormSchema>;

const fieldNames = ['cropId', 'variety', 'method', 'plantedOn', 'layout', 'rowCount', 'quantity', 'status', 'notes', 'keepReason'] as const;

export interface PlantingFormProps {
  clubId: number;
  plot: { id: number; width: number; length: number; units: UnitSystem };
  others: DrawnPart[];
  onSaved: (planting: Planting) => void;
  onCancel: () => void;
  /** The dry run shown under the form (the neighbour check); left out, the form saves without it. */
  Check?: NeighbourCheckSlots['PlantingCheck'];
}

/**
 * Adds a planting to this season: crop (searchable), variety, the part of the plot, how and when, rows or plants.
 * As it is filled in, the neighbour check runs on it; a clash asks why the holder keeps the planting.
 */
export function PlantingForm({ clubId, plot, others, onSaved, onCancel, Check }: PlantingFormProps) {
  const zone = useTimeZone();
  const crops = useCropOptions(clubId);
  const create = useCreatePlanting(plot.id);
  const [search, setSearch] = useState('');
  const [part, setPart] = useState<PlotPart | null>(null);
  const [partError, setPartError] = useState<string | undefined>();
  const [formError, setFormError] = useState<string | null>(null);
  // The dry run found a clash, or the server refused to save this very planting for want of a reason: either way the
  // reason box shows. The server's word holds until crop, part, method, date or the like change.
  const [dryRunClash, setDryRunClash] = useState(false);
  const [reasonAskedFor, setReasonAskedFor] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    setFocus,
    control,
    formState: { errors },
  } = useForm<FormInput, unknown, z.output<typeof FormSchema>>({
    resolver: zodResolver(FormSchema),
    defaultValues: { cropId: '', variety: '', method: 'sown', plantedOn: localToday(zone), layout: 'rows', rowCount: '', quantity: '', status: 'planned', notes: '', keepReason: '' },
  });
  const [cropId, method, plantedOn, layout, rowCount, quantity, status] = useWatch({
    control,
    name: ['cropId', 'method', 'plantedOn', 'layout', 'rowCount', 'quantity', 'status'],
  });
  const draft = useMemo(
    () => draftFromForm({ cropId, method, plantedOn, layout, rowCount, quantity, status }, part),
    [cropId, method, plantedOn, layout, rowCount, quantity, status, part],
  );
  const draftKey = JSON.stringify(draft);
  const serverWantsReason = reasonAskedFor === draftKey;
  const needsReason = dryRunClash || serverWantsReason;
  useEffect(() => {
    if (serverWantsReason) setFocus('keepReason');
  }, [serverWantsReason, setFocus]);
  const options = useMemo(() => {
    const all = crops.data?.items ?? [];
    const q = search.trim().toLowerCase();
    return q ? all.filter((c) => c.commonName.toLowerCase().includes(q) || c.botanicalName.toLowerCase().includes(q) || String(c.id) === cropId) : all;
  }, [crops.data, search, cropId]);

  const pickCrop = (id: string) => {
    const crop = crops.data?.items.find((c) => String(c.id) === id);
    // The crop notes say whether it is usually sown in place or planted out.
    if (crop) setValue('method', crop.sowing === 'transplant' ? 'transplanted' : 'sown');
  };

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setPartError(undefined);
    const keepReason = values.keepReason.trim();
    if (needsReason && !keepReason) {
      setError('keepReason', { type: 'required', message: 'Say why you keep this planting despite the clash' }, { shouldFocus: true });
      return;
    }
    create.mutate(
      { ...values, part, keepReason: needsReason ? keepReason : null },
      {
        onSuccess: onSaved,
        onError: (error) => {
          if (isApiError(error) && error.fields) {
            const partMessage = Object.entries(error.fields).find(([k]) => k === 'part' || k.startsWith('part.'))?.[1];
            if (partMessage) setPartError(partMessage);
            // A clash the dry run had not shown yet: the box appears with the server's words on it, the rest kept.
            if (error.fields.keepReason) setReasonAskedFor(draftKey);
          }
          setFormError(applyServerErrors(error, setError, fieldNames));
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Find a crop" hint="Type part of its name." value={search} onChange={(e) => setSearch(e.target.value)} autoComplete="off" />
        <Select
          label="Crop"
          error={errors.cropId?.message}
          disabled={crops.isPending}
          {...register('cropId', { onChange: (e) => pickCrop(e.target.value) })}
        >
          <option value="">{crops.isPending ? 'Loading the crop notes…' : `Choose (${options.length} shown)`}</option>
          {options.map((c) => (
            <option key={c.id} value={c.id}>
              {c.commonName}
            </option>
          ))}
        </Select>
      </div>
      <TextField label="Variety (optional)" autoComplete="off" error={errors.variety?.message} {...register('variety')} />
      <PartPicker plot={plot} value={part} onChange={setPart} others={others} error={partError} />
      <fieldset>
        <legend className="mb-1 font-medium">How</legend>
        <div className="flex flex-wrap gap-x-6">
          {(['sown', 'transplanted'] as const).map((m) => (
            <label key={m} className="flex min-h-11 cursor-pointer items-center gap-2">
              <input type="radio" value={m} className="size-5 accent-leaf" {...register('method')} />
              {m === 'sown' ? 'Sown in place' : 'Planted out (transplanted)'}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label={cropId ? 'Date sown or planted out' : 'Date'} type="date" error={errors.plantedOn?.message} {...register('plantedOn')} />
        <Select label="Status" error={errors.status?.message} {...register('status')}>
          {plantingStatuses.map((s) => (
            <option key={s} value={s}>
              {statusWords[s]}
            </option>
          ))}
        </Select>
      </div>
      <fieldset>
        <legend className="mb-1 font-medium">Layout</legend>
        <div className="flex flex-wrap gap-x-6">
          <label className="flex min-h-11 cursor-pointer items-center gap-2">
            <input type="radio" value="rows" className="size-5 accent-leaf" {...register('layout')} /> In rows
          </label>
          <label className="flex min-h-11 cursor-pointer items-center gap-2">
            <input type="radio" value="intensive" className="size-5 accent-leaf" {...register('layout')} /> Equal spacing (intensive bed)
          </label>
        </div>
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Rows (optional)" inputMode="numeric" hint="Leave empty to fit as many as the spacing allows." error={errors.rowCount?.message} {...register('rowCount')} />
        <TextField label="Plants or seeds (optional)" inputMode="numeric" error={errors.quantity?.message} {...register('quantity')} />
      </div>
      <TextAreaField label="Notes (optional)" rows={3} error={errors.notes?.message} {...register('notes')} />
      {Check && <Check plotId={plot.id} draft={draft} onClashChange={setDryRunClash} />}
      {needsReason && (
        <TextAreaField
          label="Why keep this planting?"
          hint="The check found a clash. Say in a line or two why you plant it here anyway (up to 500 characters); the coordinators can read it."
          rows={3}
          required
          error={errors.keepReason?.message}
          {...register('keepReason')}
        />
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={create.isPending} loadingText="Saving…">
          Save the planting
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
