import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { pestsAndDiseases } from '@shared/crops/pests';
import { localToday } from '@shared/dates';
import { MAX_PHOTOS_PER_OBSERVATION, ObservationBodySchema, severities, type ObservationBody, type Planting } from '@shared/schemas/plot-book';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, inputClasses, TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useTimeZone } from '@/lib/time-zone';
import { useAddObservation } from '../api/add-observation';
import { plantingName } from '../lib/format';

const severityWords = { light: 'Light: a few plants or leaves', moderate: 'Moderate: spreading', severe: 'Severe: most of the crop' } as const;
const OTHER = 'other';

// The form keeps a pest choice (or "something else" with a name and kind); the shared body schema
// then checks it as the server will, and its messages land on the same boxes.
const FormSchema = z
  .object({
    pest: z.string().min(1, 'Choose what you saw'),
    name: z.string(),
    kind: z.enum(['pest', 'disease', 'other']),
    severity: z.enum(severities),
    observedOn: z.string(),
    plantingId: z.string(),
    notes: z.string(),
  })
  .transform((v, ctx): ObservationBody => {
    const other = v.pest === OTHER;
    const body = ObservationBodySchema.safeParse({
      pestSlug: other ? null : v.pest,
      name: other ? v.name : null,
      kind: other ? v.kind : null,
      severity: v.severity,
      observedOn: v.observedOn,
      notes: v.notes,
      plantingId: v.plantingId ? Number(v.plantingId) : null,
    });
    if (body.success) return body.data;
    for (const issue of body.error.issues) {
      const field = issue.path[0] === 'pestSlug' ? 'pest' : String(issue.path[0]);
      ctx.addIssue({ code: 'custom', path: [field], message: issue.message });
    }
    return z.NEVER;
  });
type FormInput = z.input<typeof FormSchema>;
const fieldNames = ['name', 'kind', 'severity', 'observedOn', 'plantingId', 'notes'] as const;

/**
 * Records a pest or disease seen on the plot (from the crop notes' list, or named freely), how bad,
 * when, on which planting, with up to four photos. Soil-borne diseases are kept against the soil.
 */
export function ObservationForm({ plotId, plantings, onDone }: { plotId: number; plantings: Planting[]; onDone: () => void }) {
  const zone = useTimeZone();
  const add = useAddObservation(plotId);
  const [photos, setPhotos] = useState<File[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    control,
    setError,
    formState: { errors },
  } = useForm<FormInput, unknown, ObservationBody>({
    resolver: zodResolver(FormSchema),
    defaultValues: { pest: '', name: '', kind: 'pest', severity: 'light', observedOn: localToday(zone), plantingId: '', notes: '' },
  });
  const pest = useWatch({ control, name: 'pest' });
  const chosen = pestsAndDiseases.find((p) => p.slug === pest);
  const saved = (add.error as { savedObservation?: unknown } | null)?.savedObservation;

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    add.mutate(
      { body, photos },
      {
        onSuccess: onDone,
        onError: (error) => {
          if ((error as { savedObservation?: unknown }).savedObservation) return;
          setFormError(applyServerErrors(error, setError, fieldNames));
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {saved ? (
        <Alert tone="warning" title="Saved, but a photo was refused">
          {(add.error as { photoName?: string }).photoName}: {add.error!.message} The observation and any photos before it are kept.
        </Alert>
      ) : (
        formError && <Alert tone="error">{formError}</Alert>
      )}
      <Select label="What did you see?" error={errors.pest?.message} {...register('pest')}>
        <option value="">Choose</option>
        <optgroup label="Pests">
          {pestsAndDiseases.filter((p) => p.kind === 'pest').map((p) => (
            <option key={p.slug} value={p.slug}>
              {p.name}
            </option>
          ))}
        </optgroup>
        <optgroup label="Diseases">
          {pestsAndDiseases.filter((p) => p.kind === 'disease').map((p) => (
            <option key={p.slug} value={p.slug}>
              {p.name}
              {p.soilBorne ? ' (stays in the soil)' : ''}
            </option>
          ))}
        </optgroup>
        <option value={OTHER}>Something else…</option>
      </Select>
      {chosen?.soilBorne && (
        <Alert tone="info" announce={false}>
          {chosen.name} stays in the soil. It is kept in the plot’s history, and the crops it affects should not go back here for several years.
        </Alert>
      )}
      {pest === OTHER && (
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label="Name it" error={errors.name?.message} {...register('name')} />
          <Select label="It is a" error={errors.kind?.message} {...register('kind')}>
            <option value="pest">Pest</option>
            <option value="disease">Disease</option>
            <option value="other">Something else</option>
          </Select>
        </div>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <Select label="How bad" error={errors.severity?.message} {...register('severity')}>
          {severities.map((s) => (
            <option key={s} value={s}>
              {severityWords[s]}
            </option>
          ))}
        </Select>
        <TextField label="Seen on" type="date" error={errors.observedOn?.message} {...register('observedOn')} />
      </div>
      {plantings.length > 0 && (
        <Select label="On which planting (optional)" error={errors.plantingId?.message} {...register('plantingId')}>
          <option value="">The plot in general</option>
          {plantings.map((p) => (
            <option key={p.id} value={p.id}>
              {plantingName(p)}
            </option>
          ))}
        </Select>
      )}
      <TextAreaField label="Notes (optional)" rows={3} error={errors.notes?.message} {...register('notes')} />
      <Field label={`Photos (up to ${MAX_PHOTOS_PER_OBSERVATION}, optional)`} hint="PNG, JPEG or WebP. Location and camera details are removed." error={photoError ?? undefined}>
        {({ inputId, describedBy }) => (
          <input
            id={inputId}
            aria-describedby={describedBy}
            type="file"
            accept="image/png,image/jpeg,image/webp"
            multiple
            className={`${inputClasses} file:mr-3 file:rounded file:border-0 file:bg-paper-100 file:px-3 file:py-1`}
            onChange={(e) => {
              const files = [...(e.target.files ?? [])];
              setPhotoError(files.length > MAX_PHOTOS_PER_OBSERVATION ? `Choose at most ${MAX_PHOTOS_PER_OBSERVATION} photos` : null);
              setPhotos(files.slice(0, MAX_PHOTOS_PER_OBSERVATION));
            }}
          />
        )}
      </Field>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={add.isPending} loadingText="Saving…" disabled={photoError !== null || Boolean(saved)}>
          Save the observation
        </Button>
        <Button variant="ghost" onClick={onDone}>
          {saved ? 'Close' : 'Cancel'}
        </Button>
      </div>
    </form>
  );
}
