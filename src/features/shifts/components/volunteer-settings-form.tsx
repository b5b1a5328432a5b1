import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { VolunteerSettingsSchema, type VolunteerSettings } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { ErrorState } from '@/components/ui/error-state';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useVolunteerSettings } from '../api/get-volunteer-settings';
import { useUpdateVolunteerSettings } from '../api/update-volunteer-settings';
import { weekdayNames } from '../lib/words';

interface FormValues {
  /** "" for no weekly e-mail, else "0" (Sunday) to "6" (Saturday). */
  digestDay: string;
  helpMail: boolean;
  reminders: boolean;
}

const FormSchema = z.object({
  digestDay: z
    .string()
    .transform((v) => (v === '' ? null : Number(v)))
    .pipe(VolunteerSettingsSchema.shape.digestDay),
  helpMail: VolunteerSettingsSchema.shape.helpMail,
  reminders: VolunteerSettingsSchema.shape.reminders,
});

const toForm = (s: VolunteerSettings): FormValues => ({ digestDay: s.digestDay === null ? '' : String(s.digestDay), helpMail: s.helpMail, reminders: s.reminders });

// Monday first, as the board's weeks; the numbers stay the server's (0 Sunday … 6 Saturday).
const dayOptions = [1, 2, 3, 4, 5, 6, 0];

function Form({ clubId, saved }: { clubId: number; saved: VolunteerSettings }) {
  const update = useUpdateVolunteerSettings(clubId);
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useForm<FormValues, unknown, VolunteerSettings>({ resolver: zodResolver(FormSchema), defaultValues: toForm(saved) });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setDone(false);
    update.mutate(values, {
      onSuccess: (next) => {
        reset(toForm(next));
        setDone(true);
      },
      onError: (error) => setFormError(applyServerErrors(error, setError, ['digestDay', 'helpMail', 'reminders'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {done && <Alert tone="success">Saved. Your choices apply to this club only.</Alert>}
      {formError && <Alert tone="error">{formError}</Alert>}
      <Select
        label="A weekly e-mail of the shifts that need people"
        hint="Sent on the day you choose, with a link to take each place."
        error={errors.digestDay?.message}
        className="sm:max-w-sm"
        {...register('digestDay', { onChange: () => setDone(false) })}
      >
        <option value="">No weekly e-mail</option>
        {dayOptions.map((d) => (
          <option key={d} value={d}>
            Every {weekdayNames[d]}
          </option>
        ))}
      </Select>
      <Checkbox
        label="E-mails when a coordinator asks for help with a shift"
        hint="Sent when a shift still needs people and a coordinator asks for more hands."
        {...register('helpMail', { onChange: () => setDone(false) })}
      />
      <Checkbox
        label="A reminder the day before a shift I have a place on"
        hint="The confirmation when you take a place is always sent."
        {...register('reminders', { onChange: () => setDone(false) })}
      />
      <Button type="submit" loading={update.isPending} loadingText="Saving…" disabled={!isDirty} className="self-start">
        Save my choices
      </Button>
    </form>
  );
}

/** A volunteer's e-mail choices about shifts: the weekly e-mail's day (or none), and help e-mails and reminders on or off. */
export function VolunteerSettingsForm({ clubId }: { clubId: number }) {
  const settings = useVolunteerSettings(clubId);
  if (settings.isPending) return <LoadingState label="Loading your choices…" />;
  if (settings.isError) {
    return (
      <ErrorState
        message={settings.error.message}
        requestId={isApiError(settings.error) ? settings.error.requestId : undefined}
        onRetry={() => void settings.refetch()}
        retrying={settings.isFetching}
      />
    );
  }
  return <Form clubId={clubId} saved={settings.data} />;
}
