import { zodResolver } from '@hookform/resolvers/zod';
import { addDays, format } from 'date-fns';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { SeasonCreateBodySchema } from '@shared/schemas/seasons';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useOpenSeason } from '../api/open-season';

// The form takes a calendar date; the deadline is the end of that day in the browser's zone.
const FormSchema = z
  .object({ year: z.string().regex(/^\d{4}$/, 'A year like 2027'), renewalDeadline: z.iso.date('Choose a date') })
  .transform((v) => ({ year: Number(v.year), renewalDeadline: new Date(`${v.renewalDeadline}T23:59:00`).toISOString() }))
  .pipe(SeasonCreateBodySchema);
type FormInput = z.input<typeof FormSchema>;

/** Opens next season: renewal e-mails go to last season's holders in good standing. */
export function OpenSeasonForm({ clubId, suggestedYear }: { clubId: number; suggestedYear: number }) {
  const open = useOpenSeason(clubId);
  const [alert, setAlert] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<FormInput, unknown, z.output<typeof FormSchema>>({
    resolver: zodResolver(FormSchema),
    defaultValues: { year: String(suggestedYear), renewalDeadline: format(addDays(new Date(), 14), 'yyyy-MM-dd') },
  });
  const submit = handleSubmit(async (body) => {
    setAlert(null);
    try {
      const opened = await open.mutateAsync(body);
      // Ready for the season after, without losing the result shown below.
      reset({ year: String(opened.season.year + 1), renewalDeadline: format(addDays(new Date(), 14), 'yyyy-MM-dd') });
    } catch (err) {
      setAlert(applyServerErrors(err, setError, ['year', 'renewalDeadline']));
    }
  });
  const result = open.data;
  return (
    <div className="space-y-4">
      <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-3">
        <TextField label="Season" inputMode="numeric" className="w-32" {...register('year')} error={formState.errors.year?.message} />
        <TextField
          label="Renewals must be answered by"
          type="date"
          {...register('renewalDeadline')}
          error={formState.errors.renewalDeadline?.message}
        />
        <Button type="submit" loading={formState.isSubmitting} loadingText="Opening and sending renewals…">
          Open the season and send renewals
        </Button>
      </form>
      {alert && <Alert tone="error">{alert}</Alert>}
      {result && (
        <Alert tone="success" title={`The ${result.season.year} season is open`}>
          {result.renewalsSent} renewal e-mail{result.renewalsSent === 1 ? '' : 's'} sent.
          {result.notRenewed.length > 0 && (
            <> Not offered a renewal: {result.notRenewed.map((n) => `${n.name} (${n.plotLabel}: ${n.reason.toLowerCase()})`).join('; ')}.</>
          )}
        </Alert>
      )}
    </div>
  );
}
