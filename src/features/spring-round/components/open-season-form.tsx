import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { addCalendarDays, endOfLocalDay, localToday } from '@shared/dates';
import { SeasonCreateBodySchema } from '@shared/schemas/seasons';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useTimeZone } from '@/lib/time-zone';
import { useOpenSeason } from '../api/open-season';

// The form takes a calendar date; the deadline is the end of that day (23:59:59) in the club's zone.
function formSchema(timeZone: string) {
  return z
    .object({ year: z.string().regex(/^\d{4}$/, 'A year like 2027'), renewalDeadline: z.iso.date('Choose a date') })
    .transform((v) => ({ year: Number(v.year), renewalDeadline: endOfLocalDay(v.renewalDeadline, timeZone).toISOString() }))
    .pipe(SeasonCreateBodySchema.required());
}
type FormSchema = ReturnType<typeof formSchema>;
type FormInput = z.input<FormSchema>;

/** Opens next season: renewal e-mails go to last season's holders in good standing. */
export function OpenSeasonForm({ clubId, suggestedYear, renewalDays }: { clubId: number; suggestedYear: number; renewalDays: number }) {
  const open = useOpenSeason(clubId);
  const timeZone = useTimeZone();
  const schema = useMemo(() => formSchema(timeZone), [timeZone]);
  // The club's renewal days from today, in the club's calendar.
  const defaultDeadline = () => addCalendarDays(localToday(timeZone), renewalDays);
  const [alert, setAlert] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<FormInput, unknown, z.output<FormSchema>>({
    resolver: zodResolver(schema),
    defaultValues: { year: String(suggestedYear), renewalDeadline: defaultDeadline() },
  });
  const submit = handleSubmit(async (body) => {
    setAlert(null);
    try {
      const opened = await open.mutateAsync(body);
      // Ready for the season after, without losing the result shown below.
      reset({ year: String(opened.season.year + 1), renewalDeadline: defaultDeadline() });
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
