import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { formatDateTime } from '@shared/dates';
import type { UnitSystem } from '@shared/geometry';
import type { WeatherDay } from '@shared/schemas/weather';
import { weatherQuantities, weatherUnitLabel, weatherValueKeys } from '@shared/weather';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { usePutWeatherDay } from '../api/put-weather-day';
import { dayText, sourceWords } from '../lib/format';
import { valueText, weatherFormSchema, type WeatherFormResult, type WeatherFormValues } from '../lib/weather-form';

export interface WeatherDayDialogProps {
  siteId: number;
  units: UnitSystem;
  timeZone: string;
  today: string;
  /** The day to edit; null to add a day. */
  day: WeatherDay | null;
  open: boolean;
  onClose: () => void;
  onSaved: (day: WeatherDay) => void;
}

/** Every value of one day in the site's units; a blank input clears the value. Adding a day asks for its date too. */
export function WeatherDayDialog({ siteId, units, timeZone, today, day, open, onClose, onSaved }: WeatherDayDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={day ? `Weather on ${dayText(day.day)}` : 'Add a day'}
      description={
        day ? (
          <p>
            {sourceWords[day.source]}, last changed {formatDateTime(day.updatedAt, timeZone)}
            {day.enteredByName ? ` by ${day.enteredByName}` : ''}. Leave a box empty to clear it.
          </p>
        ) : (
          <p>Fill in what you measured; every box may stay empty but one.</p>
        )
      }
    >
      {open && <DayForm key={day?.day ?? 'new'} siteId={siteId} units={units} today={today} day={day} onClose={onClose} onSaved={onSaved} />}
    </Dialog>
  );
}

function DayForm({ siteId, units, today, day, onClose, onSaved }: Omit<WeatherDayDialogProps, 'open' | 'timeZone'>) {
  const save = usePutWeatherDay(siteId);
  const [formError, setFormError] = useState<string | null>(null);
  const schema = useMemo(() => weatherFormSchema({ keys: weatherValueKeys, units, blank: 'null', today }), [units, today]);
  const defaults: WeatherFormValues = { day: day?.day ?? today };
  for (const k of weatherValueKeys) defaults[k] = day ? valueText(k, day[k], units) : '';
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<WeatherFormValues, unknown, WeatherFormResult>({ resolver: zodResolver(schema), defaultValues: defaults });

  const submit = handleSubmit((form) => {
    setFormError(null);
    save.mutate(
      { day: form.day, body: { ...form.values, source: 'form' } },
      {
        onSuccess: (saved) => onSaved(saved),
        onError: (error) => setFormError(applyServerErrors(error, setError, ['day', ...weatherValueKeys])),
      },
    );
  });

  return (
    <form onSubmit={(event) => void submit(event)} noValidate className="flex flex-col gap-4">
      {!day && <TextField label="Day" type="date" min="2000-01-01" max={today} error={errors.day?.message} {...register('day')} />}
      <div className="grid max-h-[55dvh] grid-cols-2 gap-3 overflow-y-auto pr-1">
        {weatherQuantities.map((q) => (
          <TextField
            key={q.key}
            label={`${q.label} (${weatherUnitLabel(q.kind, units)})`}
            inputMode="decimal"
            autoComplete="off"
            error={errors[q.key]?.message}
            {...register(q.key)}
          />
        ))}
      </div>
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={save.isPending} loadingText="Saving…">
          Save the day
        </Button>
        <Button variant="secondary" onClick={onClose} disabled={save.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
