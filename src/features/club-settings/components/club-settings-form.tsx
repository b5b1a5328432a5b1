import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { ClubSettingsSchema, currencies, type ClubSettings, type ClubSettingsUpdateBody } from '@shared/schemas/clubs';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { TextField } from '@/components/ui/field';
import { EmailSchema } from '@shared/schemas/common';
import { Select } from '@/components/ui/select';
import { currencyLabels, timeZoneNames } from '@/lib/club-choices';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useUpdateClubSettings } from '../api/update-club-settings';

const shape = ClubSettingsSchema.shape;
const daysText = (days: typeof shape.offerDays) =>
  z.string().trim().regex(/^\d+$/, 'Enter a whole number of days').transform(Number).pipe(days);

/** What the inputs hold: day counts as typed text. */
interface SettingsFormValues {
  name: string;
  currency?: ClubSettings['currency'];
  offerDays: string;
  renewalDays: string;
  declinedOfferPolicy: ClubSettings['declinedOfferPolicy'];
  allowMultipleOffers: boolean;
  timeZone: string;
  contactEmail: string;
  feeNote: string;
  typicalWait: string;
  rotationGapYears: string;
  sharesPlotBooks: boolean;
  raisedBedWaterFactor: string;
  containerWaterFactor: string;
  volunteerHoursRequired: string;
}

/** An empty box clears the value. */
const orNull = (schema: z.ZodType<string, string>) =>
  z.string().transform((v) => v.trim()).pipe(z.union([z.literal('').transform(() => null), schema]));

/** A multiplier typed as text: "1.2" or "1,2". */
const factorText = (schema: z.ZodNumber) =>
  z
    .string()
    .trim()
    .regex(/^\d+([.,]\d+)?$/, 'Enter a number like 1.2')
    .transform((v) => Number(v.replace(',', '.')))
    .pipe(schema);

/** Hours typed as text ("10", "7.5" or "7,5"); an empty box means the club asks for no set number. */
const optionalHoursText = z
  .string()
  .trim()
  .refine((v) => v === '' || /^\d+([.,]\d+)?$/.test(v), 'Enter a number of hours like 10, or leave it empty')
  .transform((v) => (v === '' ? null : Number(v.replace(',', '.'))))
  .pipe(z.number().max(500, 'At most 500 hours').nullable())
  .pipe(shape.volunteerHoursRequired);

const SettingsFormSchema = z.object({
  name: z.string().trim().min(1, 'Enter a name').max(160, 'At most 160 characters'),
  currency: shape.currency.optional(),
  offerDays: daysText(shape.offerDays),
  renewalDays: daysText(shape.renewalDays),
  declinedOfferPolicy: shape.declinedOfferPolicy,
  allowMultipleOffers: z.boolean(),
  timeZone: z.string().trim().min(1, 'Enter a time zone, like Europe/London').pipe(shape.timeZone),
  contactEmail: orNull(EmailSchema),
  feeNote: orNull(z.string().max(200, 'At most 200 characters')),
  typicalWait: orNull(z.string().max(200, 'At most 200 characters')),
  rotationGapYears: z.string().trim().regex(/^\d+$/, 'Enter a whole number of years').transform(Number).pipe(shape.rotationGapYears),
  sharesPlotBooks: z.boolean(),
  raisedBedWaterFactor: factorText(shape.raisedBedWaterFactor),
  containerWaterFactor: factorText(shape.containerWaterFactor),
  volunteerHoursRequired: optionalHoursText,
});

const fieldNames = ['name', 'currency', 'offerDays', 'renewalDays', 'declinedOfferPolicy', 'allowMultipleOffers', 'timeZone', 'contactEmail', 'feeNote', 'typicalWait', 'rotationGapYears', 'sharesPlotBooks', 'raisedBedWaterFactor', 'containerWaterFactor', 'volunteerHoursRequired'] as const;

function toForm(s: ClubSettings): SettingsFormValues {
  return {
    name: s.name,
    currency: s.currency,
    offerDays: String(s.offerDays),
    renewalDays: String(s.renewalDays),
    declinedOfferPolicy: s.declinedOfferPolicy,
    allowMultipleOffers: s.allowMultipleOffers,
    timeZone: s.timeZone,
    contactEmail: s.contactEmail ?? '',
    feeNote: s.feeNote ?? '',
    typicalWait: s.typicalWait ?? '',
    rotationGapYears: String(s.rotationGapYears),
    sharesPlotBooks: s.sharesPlotBooks,
    raisedBedWaterFactor: String(s.raisedBedWaterFactor),
    containerWaterFactor: String(s.containerWaterFactor),
    volunteerHoursRequired: s.volunteerHoursRequired === null ? '' : String(s.volunteerHoursRequired),
  };
}

export interface ClubSettingsFormProps {
  settings: ClubSettings;
  /** Called after a save, so the app can refresh what shows the club's name elsewhere. */
  onSaved?: (settings: ClubSettings) => void;
}

/** The club's name, currency and spring-round rules. */
export function ClubSettingsForm({ settings, onSaved }: ClubSettingsFormProps) {
  const update = useUpdateClubSettings(settings.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<SettingsFormValues, unknown, ClubSettingsUpdateBody>({
    resolver: zodResolver(SettingsFormSchema),
    defaultValues: toForm(settings),
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setSaved(false);
    // A locked currency is not the person's to send; the field only shows it.
    const body = settings.currencyLocked ? { ...values, currency: undefined } : values;
    update.mutate(body, {
      onSuccess: (next) => {
        reset(toForm(next));
        setSaved(true);
        onSaved?.(next);
      },
      onError: (error) => setFormError(applyServerErrors(error, setError, fieldNames)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {saved && <Alert tone="success">Club settings saved.</Alert>}
      {formError && <Alert tone="error">{formError}</Alert>}
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField label="Club name" autoComplete="organization" error={errors.name?.message} {...register('name')} />
        <Select
          label="Currency"
          hint={
            settings.currencyLocked
              ? `Fees are already recorded in ${currencyLabels[settings.currency]}, so the currency cannot change: fees keep the currency they were charged in.`
              : 'Fees and receipts are in this currency. It is fixed once the first fee is recorded.'
          }
          error={errors.currency?.message}
          disabled={settings.currencyLocked}
          {...register('currency')}
        >
          {currencies.map((c) => (
            <option key={c} value={c}>
              {currencyLabels[c]}
            </option>
          ))}
        </Select>
        <TextField
          label="Days to answer an offer"
          hint="From 1 to 60. After that the offer lapses and the plot can go to the next person."
          inputMode="numeric"
          error={errors.offerDays?.message}
          {...register('offerDays')}
        />
        <TextField
          label="Days to answer a renewal"
          hint="From 1 to 90. Plots not kept by then are free for the waiting list."
          inputMode="numeric"
          error={errors.renewalDays?.message}
          {...register('renewalDays')}
        />
        <Select
          label="When someone declines an offer"
          error={errors.declinedOfferPolicy?.message}
          {...register('declinedOfferPolicy')}
        >
          <option value="end_of_list">Move them to the end of the waiting list</option>
          <option value="remove">Take them off the waiting list</option>
        </Select>
        <TextField
          label="Time zone"
          hint="Dates and deadlines on the club's pages and e-mails are in this zone, e.g. Europe/London"
          list="club-settings-time-zones"
          autoComplete="off"
          spellCheck={false}
          error={errors.timeZone?.message}
          {...register('timeZone')}
        />
        <TextField
          label="Contact e-mail"
          hint="Replies to the club's e-mails go here. Leave it empty and people cannot answer them."
          type="email"
          autoComplete="email"
          error={errors.contactEmail?.message}
          {...register('contactEmail')}
        />
        <TextField
          label="Fee, for the application form"
          hint="What a plot costs, in your words, e.g. “From £25 a year for a small plot”. Leave it empty to say nothing."
          error={errors.feeNote?.message}
          {...register('feeNote')}
        />
        <TextField
          label="Typical wait, for the application form"
          hint="How long people usually wait for a plot, e.g. “About 18 months”. Leave it empty to say nothing."
          error={errors.typicalWait?.message}
          {...register('typicalWait')}
        />
        <TextField
          label="Years before a family returns to the same soil"
          hint="From 1 to 10; 3 is common advice (WVU Extension gives 2–3). Soil-borne diseases such as clubroot keep a family out longer."
          inputMode="numeric"
          error={errors.rotationGapYears?.message}
          {...register('rotationGapYears')}
        />
        <TextField
          label="Water for a raised bed, times open ground"
          hint="Raised beds dry out faster than open ground. 1.2 asks for a fifth more water; it is our starting figure, not a published one. Changing it re-plans every site's watering."
          inputMode="decimal"
          error={errors.raisedBedWaterFactor?.message}
          {...register('raisedBedWaterFactor')}
        />
        <TextField
          label="Water for a container, times open ground"
          hint="Pots and tubs dry out faster still. 1.5 is our starting figure, not a published one."
          inputMode="decimal"
          error={errors.containerWaterFactor?.message}
          {...register('containerWaterFactor')}
        />
        <TextField
          label="Volunteer hours asked for each season"
          hint="What each volunteer is asked to give in a season, e.g. 10. Volunteers see their hours against it on My shifts. Leave it empty to ask for no set number."
          inputMode="decimal"
          error={errors.volunteerHoursRequired?.message}
          {...register('volunteerHoursRequired')}
        />
        <datalist id="club-settings-time-zones">
          {timeZoneNames.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
      </div>
      <Checkbox
        label="Let one person hold more than one open offer at a time"
        hint="Leave this off to offer each free plot to a different person."
        {...register('allowMultipleOffers')}
      />
      <Checkbox
        label="Let members read each other's plot books"
        hint="Only the plot's holder and the coordinators can change a plot book either way."
        {...register('sharesPlotBooks')}
      />
      {errors.allowMultipleOffers?.message && (
        <p className="text-sm font-medium text-clay-700">{errors.allowMultipleOffers.message}</p>
      )}
      <Button type="submit" loading={update.isPending} loadingText="Saving…" className="self-start">
        Save club settings
      </Button>
    </form>
  );
}
