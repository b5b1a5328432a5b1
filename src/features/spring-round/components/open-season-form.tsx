import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { endOfLocalDay, localDateOf, localToday, suggestRenewalDeadline } from '@shared/dates';
import { SeasonCreateBodySchema, type SeasonCreateBody, type SeasonOpeningPreview } from '@shared/schemas/seasons';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { LocalDate, useTimeZone } from '@/lib/time-zone';
import { getOpeningPreview } from '../api/get-opening-preview';
import { useOpenSeason } from '../api/open-season';
import { plural } from '@/lib/format';

// The form takes a calendar date; the deadline is the end of that day (23:59:59) in the club's zone.
function formSchema(timeZone: string) {
  return z
    .object({ year: z.string().regex(/^\d{4}$/, 'A year like 2027'), renewalDeadline: z.iso.date('Choose a date') })
    .transform((v) => ({ year: Number(v.year), renewalDeadline: endOfLocalDay(v.renewalDeadline, timeZone).toISOString() }))
    .pipe(SeasonCreateBodySchema.required());
}
type FormSchema = ReturnType<typeof formSchema>;
type FormInput = z.input<FormSchema>;


export interface OpenSeasonFormProps {
  clubId: number;
  suggestedYear: number;
  renewalDays: number;
  /** The latest season's renewal deadline (ISO instant), which the new one must come after. */
  previousDeadline: string | null;
  /** Called once the season is open, so the page can point at its summary. */
  onOpened: () => void;
}

/**
 * Opens next season. Renewal e-mails go to last season's holders in good standing, so the
 * coordinator first sees how many will go, to whom not and why, and the deadline, and confirms.
 */
export function OpenSeasonForm({ clubId, suggestedYear, renewalDays, previousDeadline, onOpened }: OpenSeasonFormProps) {
  const open = useOpenSeason(clubId);
  const timeZone = useTimeZone();
  const schema = useMemo(() => formSchema(timeZone), [timeZone]);
  const defaultDeadline = suggestRenewalDeadline({
    today: localToday(timeZone),
    renewalDays,
    previousDeadline: previousDeadline ? localDateOf(previousDeadline, timeZone) : null,
  });
  const [alert, setAlert] = useState<string | null>(null);
  const [confirming, setConfirming] = useState<{ body: SeasonCreateBody; preview: SeasonOpeningPreview } | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormInput, unknown, z.output<FormSchema>>({
    resolver: zodResolver(schema),
    defaultValues: { year: String(suggestedYear), renewalDeadline: defaultDeadline },
  });

  const review = handleSubmit(async (body) => {
    setAlert(null);
    try {
      setConfirming({ body, preview: await getOpeningPreview(clubId, body.year) });
    } catch (err) {
      setAlert(isApiError(err) ? err.message : 'What opening the season would send could not be worked out. Try again.');
    }
  });

  const confirm = async () => {
    if (!confirming) return;
    try {
      await open.mutateAsync(confirming.body);
      setConfirming(null);
      onOpened();
    } catch (err) {
      setConfirming(null);
      // A refused opening keeps what was typed, with the server's reason beside the field.
      setAlert(applyServerErrors(err, setError, ['year', 'renewalDeadline']));
    }
  };

  const preview = confirming?.preview;
  return (
    <div className="space-y-4">
      <form onSubmit={review} noValidate className="flex flex-wrap items-end gap-3">
        <TextField label="Season" inputMode="numeric" className="w-32" {...register('year')} error={formState.errors.year?.message} />
        <TextField
          label="Renewals must be answered by"
          type="date"
          {...register('renewalDeadline')}
          error={formState.errors.renewalDeadline?.message}
        />
        <Button type="submit" loading={formState.isSubmitting} loadingText="Counting the renewals…">
          Review and open the season
        </Button>
      </form>
      {alert && <Alert tone="error">{alert}</Alert>}
      <Dialog
        open={confirming !== null}
        onClose={() => setConfirming(null)}
        title={preview ? `Open the ${preview.year} season?` : 'Open the season?'}
        description={
          preview
            ? preview.renewals > 0
              ? `${plural(preview.renewals, 'renewal e-mail goes', 'renewal e-mails go')} out as soon as you open it.`
              : 'No renewal e-mails go out: nobody from last season is in line for one.'
            : undefined
        }
      >
        {preview && confirming && (
          <div className="space-y-4">
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
              <dt className="font-medium">To</dt>
              <dd>
                {preview.previousYear
                  ? `${plural(preview.renewals, 'holder', 'holders')} of ${preview.previousYear} whose fee is paid`
                  : 'Nobody: this is the club’s first season'}
              </dd>
              <dt className="font-medium">Answer by</dt>
              <dd>
                <LocalDate value={confirming.body.renewalDeadline!} withTime />
              </dd>
            </dl>
            {preview.notRenewed.length > 0 && (
              <div>
                <p className="font-medium">No renewal for {plural(preview.notRenewed.length, 'holder', 'holders')}; their plots will be free:</p>
                <ul className="mt-1 list-disc space-y-1 pl-5">
                  {preview.notRenewed.map((n) => (
                    <li key={`${n.plotLabel}-${n.name}`}>
                      {n.name}, plot {n.plotLabel}: {n.reason.charAt(0).toLowerCase() + n.reason.slice(1)}
                    </li>
                  ))}
                </ul>
              </div>
            )}
            <div className="flex flex-wrap justify-end gap-2">
              <Button variant="secondary" onClick={() => setConfirming(null)}>
                Cancel
              </Button>
              <Button onClick={() => void confirm()} loading={open.isPending} loadingText="Opening…">
                {preview.renewals > 0 ? `Open and send ${plural(preview.renewals, 'renewal', 'renewals')}` : 'Open the season'}
              </Button>
            </div>
          </div>
        )}
      </Dialog>
    </div>
  );
}
