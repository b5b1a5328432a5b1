import { useState } from 'react';
import { pestsAndDiseases } from '@shared/crops/pests';
import { localToday } from '@shared/dates';
import { MAX_PHOTOS_PER_OBSERVATION, severities, type Planting } from '@shared/schemas/plot-book';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, inputClasses, TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { isApiError } from '@/lib/api/client';
import { useTimeZone } from '@/lib/time-zone';
import { useAddObservation } from '../api/add-observation';
import { plantingName } from '../lib/format';

const severityWords = { light: 'Light: a few plants or leaves', moderate: 'Moderate: spreading', severe: 'Severe: most of the crop' } as const;
const OTHER = 'other';

/**
 * Records a pest or disease seen on the plot (from the crop notes' list, or named freely), how bad,
 * when, on which planting, with up to four photos. Soil-borne diseases are kept against the soil.
 */
export function ObservationForm({ plotId, plantings, onDone }: { plotId: number; plantings: Planting[]; onDone: () => void }) {
  const zone = useTimeZone();
  const add = useAddObservation(plotId);
  const [pest, setPest] = useState('');
  const [name, setName] = useState('');
  const [kind, setKind] = useState<'pest' | 'disease' | 'other'>('pest');
  const [severity, setSeverity] = useState<(typeof severities)[number]>('light');
  const [on, setOn] = useState(localToday(zone));
  const [plantingId, setPlantingId] = useState('');
  const [notes, setNotes] = useState('');
  const [photos, setPhotos] = useState<File[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const fields = isApiError(add.error) ? (add.error.fields ?? {}) : {};
  const chosen = pestsAndDiseases.find((p) => p.slug === pest);
  const saved = (add.error as { savedObservation?: unknown } | null)?.savedObservation;

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    if (pest === '') return;
    add.mutate(
      {
        body: {
          pestSlug: pest === OTHER ? null : pest,
          name: pest === OTHER ? name : null,
          kind: pest === OTHER ? kind : null,
          severity,
          observedOn: on,
          notes,
          plantingId: plantingId ? Number(plantingId) : null,
        },
        photos,
      },
      { onSuccess: onDone },
    );
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {saved ? (
        <Alert tone="warning" title="Saved, but a photo was refused">
          {(add.error as { photoName?: string }).photoName}: {add.error!.message} The observation and any photos before it are kept.
        </Alert>
      ) : (
        add.isError && !Object.keys(fields).length && <Alert tone="error">{add.error.message}</Alert>
      )}
      <Select label="What did you see?" value={pest} onChange={(e) => setPest(e.target.value)} error={fields.pestSlug}>
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
          <TextField label="Name it" value={name} onChange={(e) => setName(e.target.value)} error={fields.name} />
          <Select label="It is a" value={kind} onChange={(e) => setKind(e.target.value as typeof kind)} error={fields.kind}>
            <option value="pest">Pest</option>
            <option value="disease">Disease</option>
            <option value="other">Something else</option>
          </Select>
        </div>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <Select label="How bad" value={severity} onChange={(e) => setSeverity(e.target.value as typeof severity)}>
          {severities.map((s) => (
            <option key={s} value={s}>
              {severityWords[s]}
            </option>
          ))}
        </Select>
        <TextField label="Seen on" type="date" value={on} onChange={(e) => setOn(e.target.value)} error={fields.observedOn} />
      </div>
      {plantings.length > 0 && (
        <Select label="On which planting (optional)" value={plantingId} onChange={(e) => setPlantingId(e.target.value)} error={fields.plantingId}>
          <option value="">The plot in general</option>
          {plantings.map((p) => (
            <option key={p.id} value={p.id}>
              {plantingName(p)}
            </option>
          ))}
        </Select>
      )}
      <TextAreaField label="Notes (optional)" rows={3} value={notes} onChange={(e) => setNotes(e.target.value)} error={fields.notes} />
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
        <Button type="submit" loading={add.isPending} loadingText="Saving…" disabled={pest === '' || photoError !== null}>
          Save the observation
        </Button>
        <Button variant="ghost" onClick={onDone}>
          {saved ? 'Close' : 'Cancel'}
        </Button>
      </div>
    </form>
  );
}
