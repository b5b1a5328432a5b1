import { useState } from 'react';
import { localToday } from '@shared/dates';
import type { UnitSystem } from '@shared/geometry';
import { weightUnits } from '@shared/schemas/plot-book';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { isApiError } from '@/lib/api/client';
import { useTimeZone } from '@/lib/time-zone';
import { useAddHarvest } from '../api/add-harvest';

type WeightUnit = (typeof weightUnits)[number];
const unitWords: Record<WeightUnit, string> = { g: 'grams', kg: 'kilograms', oz: 'ounces', lb: 'pounds' };

/** Logs one harvest of a planting: the date, a weight in the site's units, a count of pieces, or both. */
export function HarvestForm({ plotId, plantingId, units, onDone }: { plotId: number; plantingId: number; units: UnitSystem; onDone: () => void }) {
  const zone = useTimeZone();
  const add = useAddHarvest(plotId);
  const [on, setOn] = useState(localToday(zone));
  const [weight, setWeight] = useState('');
  const [unit, setUnit] = useState<WeightUnit>(units === 'us' ? 'lb' : 'kg');
  const [count, setCount] = useState('');
  const fieldErrors = isApiError(add.error) ? (add.error.fields ?? {}) : {};
  const save = (e: React.FormEvent) => {
    e.preventDefault();
    const value = Number(weight.replace(',', '.'));
    add.mutate(
      {
        plantingId,
        body: {
          harvestedOn: on,
          weight: weight.trim() === '' ? null : { value, unit },
          count: count.trim() === '' ? null : Number(count),
        },
      },
      { onSuccess: onDone },
    );
  };
  return (
    <form onSubmit={save} noValidate className="flex flex-col gap-3 rounded-lg border border-paper-200 bg-paper-50 p-4">
      {add.isError && !Object.keys(fieldErrors).length && <Alert tone="error">{add.error.message}</Alert>}
      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="Picked on" type="date" value={on} onChange={(e) => setOn(e.target.value)} error={fieldErrors.harvestedOn} />
        <TextField label="Weight" inputMode="decimal" value={weight} onChange={(e) => setWeight(e.target.value)} error={fieldErrors['weight.value'] ?? fieldErrors.weight} />
        <Select label="Unit" value={unit} onChange={(e) => setUnit(e.target.value as WeightUnit)}>
          {weightUnits.map((u) => (
            <option key={u} value={u}>
              {unitWords[u]}
            </option>
          ))}
        </Select>
        <TextField label="How many (optional)" inputMode="numeric" value={count} onChange={(e) => setCount(e.target.value)} error={fieldErrors.count} />
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
