import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { FeeSchedule } from '@shared/schemas/fees';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useSaveFeeSchedule } from '../api/save-fee-schedule';
import { ScheduleFormSchema, scheduleFieldNames, scheduleToForm, type ScheduleFormValues } from '../lib/schedule-form';
import { FeeQuoteExample } from './fee-quote-example';

const unitLabels = { m2: 'm²', ft2: 'ft²' } as const;

export interface FeeScheduleFormProps {
  clubId: number;
  schedule: FeeSchedule;
  currency: string;
}

/** How the club charges for plots, typed as decimals in the club currency, with a live example. */
export function FeeScheduleForm({ clubId, schedule, currency }: FeeScheduleFormProps) {
  const save = useSaveFeeSchedule(clubId);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const {
    register,
    control,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<ScheduleFormValues, unknown, FeeSchedule>({
    resolver: zodResolver(ScheduleFormSchema),
    defaultValues: scheduleToForm(schedule),
  });
  const values = useWatch({ control });
  const basis = values.basis ?? schedule.basis;
  const unit = unitLabels[values.areaUnit ?? schedule.areaUnit];
  const moneyHint = `In ${currency}, like 45.00`;

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    setSaved(false);
    save.mutate(body, {
      onSuccess: (next) => {
        reset(scheduleToForm(next));
        setSaved(true);
      },
      onError: (error) => setFormError(applyServerErrors(error, setError, scheduleFieldNames)),
    });
  });

  const money = (name: (typeof scheduleFieldNames)[number], label: string, hint = moneyHint) => (
    <TextField label={label} hint={hint} inputMode="decimal" autoComplete="off" error={errors[name]?.message} {...register(name)} />
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {saved && <Alert tone="success">Fee schedule saved. New fees use it; fees already charged keep their amounts.</Alert>}
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="grid gap-5 sm:grid-cols-2">
        <Select label="Charge plots" error={errors.basis?.message} {...register('basis')}>
          <option value="area">By area</option>
          <option value="kind">By kind of plot</option>
        </Select>
        {basis === 'area' ? (
          <Select label="Area unit" error={errors.areaUnit?.message} {...register('areaUnit')}>
            <option value="m2">Square metres (m²)</option>
            <option value="ft2">Square feet (ft²)</option>
          </Select>
        ) : (
          <div className="hidden sm:block" />
        )}
        {basis === 'area' ? (
          money('rateMinorPerArea', `Rate per ${unit}`, `In ${currency}, like 2.50`)
        ) : (
          <>
            {money('priceInGroundMinor', 'In-ground plot')}
            {money('priceRaisedBedMinor', 'Raised bed')}
            {money('priceContainerMinor', 'Container')}
            {money('priceSharedBedMinor', 'Shared bed')}
          </>
        )}
        <TextField
          label="Concession (% off)"
          hint="Taken off the plot fee for members given a concession; 0 for none. The deposit is never reduced."
          inputMode="numeric"
          autoComplete="off"
          error={errors.concessionPercent?.message}
          {...register('concessionPercent')}
        />
        {money('depositMinor', 'Deposit', `In ${currency}; paid with the fee and handed back when the plot is returned`)}
      </div>
      <FeeQuoteExample values={values} currency={currency} />
      <Button type="submit" loading={save.isPending} loadingText="Saving…" className="self-start">
        Save fee schedule
      </Button>
    </form>
  );
}
