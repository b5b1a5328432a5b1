import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { localToday } from '@shared/dates';
import type { UnitSystem } from '@shared/geometry';
import { HarvestBodySchema, weightUnits, type HarvestBody } from '@shared/schemas/plot-book';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useTimeZone } from '@/lib/time-zone';
import { useAddHarvest } from '../api/add-harvest';

type WeightUnit = (typeof weightUnits)[number];
const unitWords: Record<WeightUnit, string> = { g: 'grams', kg: 'kilograms', oz: 'ounces', lb: 'pounds' };

const optionalNumber = (message: string) =>
  z
    .string()
    .trim()
    .refine((v) => v === '' || Number.isFinite(Number(v.replace(',', '.'))), message)
    .transform((v) => (v === '' ? null : Number(v.replace(',', '.'))));

// The boxes hold text; the shared body schema then checks the numbers as the server will.
const FormSchema = z
  .object({ harvestedOn: z.string(), weight: optionalNumber('A number, like 1.5'), unit: z.enum(weightUnits), count: optionalNumber('A whole number') })
  .transform((v, ctx): HarvestBody => {
    const body = HarvestBodySchema.safeParse({ harvestedOn: v.harvestedOn, weight: v.weight === null ? null : { value: v.weight, unit: v.unit }, count: v.count });
    if (body.success) return body.data;
    for (const issue of body.error.issues) {
      const field = issue.path[0] === 'weight' ? 'weight' : String(issue.path[0]);
      ctx.addIssue({ code: 'custom', path: [field], message: issue.message });
    }
    return z.NEVER;
  });
type FormInput = z.input<typeof FormSchema>;

/** Logs one harvest of a planting: the date, a weight in the site's units, a count of pieces, or both. */
export function HarvestForm({ plotId, plantingId, units, onDone }: { plotId: number; plantingId: number; units: UnitSystem; onDone: () => void }) {
  const zone = useTimeZone();
  const add = useAddHarvest(plotId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FormInput, unknown, HarvestBody>({
    resolver: zodResolver(FormSchema),
    defaultValues: { harvestedOn: localToday(zone), weight: '', unit: units === 'us' ? 'lb' : 'kg', count: '' },
  });
  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    add.mutate(
      { plantingId, body },
      {
        onSuccess: onDone,
        onError: (error) => {
          // The server names the weight's value `weight.value`; the form has one weight box.
          const weightMessage = isApiError(error) ? error.fields?.['weight.value'] : undefined;
          if (weightMessage) setError('weight', { type: 'server', message: weightMessage });
          setFormError(applyServerErrors(error, setError, ['harvestedOn', 'weight', 'count']));
        },
      },
    );
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-lg border border-paper-200 bg-paper-50 p-4">
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="Picked on" type="date" error={errors.harvestedOn?.message} {...register('harvestedOn')} />
        <TextField label="Weight" inputMode="decimal" error={errors.weight?.message} {...register('weight')} />
        <Select label="Unit" {...register('unit')}>
          {weightUnits.map((u) => (
            <option key={u} value={u}>
              {unitWords[u]}
            </option>
          ))}
        </Select>
        <TextField label="How many (optional)" inputMode="numeric" error={errors.count?.message} {...register('count')} />
      </div>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={add.isPending} loadingText="Saving…">
          Save the harvest
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
