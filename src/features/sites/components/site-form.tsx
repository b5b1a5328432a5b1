import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { lengthUnitLabel, type UnitSystem } from '@shared/geometry';
import type { Site, SiteCreateBody } from '@shared/schemas/sites';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { ApiError, isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateSite } from '../api/create-site';
import { isSiteConflict, useUpdateSite } from '../api/update-site';
import {
  convertElevationText,
  convertLengthText,
  convertTemperatureText,
  emptySiteForm,
  formFieldOf,
  lengthFields,
  newSiteLengths,
  sameFormFields,
  SiteFormSchema,
  siteChanges,
  siteFormFieldNames,
  soilTempFieldNames,
  siteToForm,
  type SiteFormValues,
} from '../lib/site-form';
import { MonthDayField } from './month-day-field';
import { SoilTempsField } from './soil-temps-field';

const serverFieldNames = [...siteFormFieldNames, ...soilTempFieldNames];

/** The server's error with its field names turned into the form's (`soilTempsC.3` → `soilTemps.3`). */
function withFormFields(error: unknown): unknown {
  if (!isApiError(error) || !error.fields) return error;
  const fields: Record<string, string> = {};
  for (const [field, message] of Object.entries(error.fields)) {
    const name = formFieldOf(field);
    fields[name] = fields[name] ? `${fields[name]} ${message}` : message;
  }
  return new ApiError({ status: error.status, code: error.code, message: error.message, fields, requestId: error.requestId });
}

const CONFLICT_MESSAGE =
  'Someone else changed this site while you were editing. The form now shows the saved details: check them and make your change again.';

// Older browsers lack the list; the field then works as plain text and the server checks the name.
const timeZones: string[] = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();

function Group({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="grid min-w-0 gap-5 sm:grid-cols-2">
      <legend className="mb-4 text-lg font-semibold text-soil">{legend}</legend>
      {children}
    </fieldset>
  );
}

export interface SiteFormProps {
  clubId: number;
  /** The site to edit; leave it out to add a new one. */
  site?: Site;
  onSaved?: (site: Site) => void;
  onCancel?: () => void;
}

/** Adds or edits a site; lengths are typed in the site's units and sent in metres. */
export function SiteForm({ clubId, site, onSaved, onCancel }: SiteFormProps) {
  const create = useCreateSite(clubId);
  const update = useUpdateSite(site?.id ?? 0);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  // The site the inputs were filled from: its version goes with the PATCH, its values decide what changed.
  const baseRef = useRef(site);
  const conflictRef = useRef(false);
  const {
    register,
    control,
    handleSubmit,
    setError,
    setValue,
    getValues,
    reset,
    formState: { errors, isDirty },
  } = useForm<SiteFormValues, unknown, SiteCreateBody>({
    resolver: zodResolver(SiteFormSchema),
    defaultValues: site ? siteToForm(site) : emptySiteForm(),
  });
  const units = useWatch({ control, name: 'units' });
  const soilTemps = useWatch({ control, name: 'soilTemps' });
  const unit = lengthUnitLabel(units);

  useEffect(() => {
    const base = baseRef.current;
    if (!site || !base || site.version === base.version) return;
    if (conflictRef.current || !isDirty) {
      conflictRef.current = false;
      baseRef.current = site;
      reset(siteToForm(site));
    } else if (sameFormFields(site, base)) {
      // Only something the form doesn't show moved on (the background): keep the person's edits.
      baseRef.current = site;
    }
  }, [site, isDirty, reset]);

  const switchUnits = (from: UnitSystem, to: UnitSystem) => {
    // The same ground in the other units, so switching never changes the site's real size.
    for (const field of lengthFields) {
      const text = getValues(field);
      const isStarter = !site && (field === 'pathWidth' || field === 'grid') && text === newSiteLengths[from][field];
      setValue(field, isStarter ? newSiteLengths[to][field] : convertLengthText(text, from, to), { shouldDirty: true });
    }
    // Soil temperatures follow the units too: °C on metric sites, °F on US ones.
    soilTempFieldNames.forEach((name) => setValue(name, convertTemperatureText(getValues(name), from, to), { shouldDirty: true }));
    setValue('elevation', convertElevationText(getValues('elevation'), from, to), { shouldDirty: true });
  };

  const onError = (error: unknown) => {
    if (isSiteConflict(error)) {
      conflictRef.current = true;
      setFormError(CONFLICT_MESSAGE);
    } else {
      setFormError(applyServerErrors(withFormFields(error), setError, serverFieldNames));
    }
  };

  const submit = (body: SiteCreateBody) => {
    setFormError(null);
    setSaved(null);
    const base = baseRef.current;
    if (!site || !base) {
      create.mutate(body, {
        onSuccess: (created) => {
          reset(emptySiteForm());
          onSaved?.(created);
        },
        onError,
      });
      return;
    }
    const changes = siteChanges(base, body);
    if (Object.keys(changes).length === 1) {
      setSaved('Nothing to save: the form matches the saved site.');
      return;
    }
    update.mutate(changes, {
      onSuccess: (next) => {
        baseRef.current = next;
        reset(siteToForm(next));
        setSaved(`Saved the changes to ${next.name}.`);
        onSaved?.(next);
      },
      onError,
    });
  };

  const unitsField = register('units');
  const pending = create.isPending || update.isPending;

  return (
    <form onSubmit={(event) => void handleSubmit(submit)(event)} noValidate className="flex flex-col gap-8">
      <Group legend="Where it is">
        <TextField
          label="Name"
          hint="What members call it, e.g. North field."
          autoComplete="off"
          error={errors.name?.message}
          {...register('name')}
        />
        <TextField
          label="Address"
          hint="Optional. How members find the gate."
          autoComplete="off"
          error={errors.address?.message}
          {...register('address')}
        />
        <TextField
          label="Latitude"
          hint="Decimal degrees; south is negative, e.g. 53.4"
          inputMode="decimal"
          autoComplete="off"
          error={errors.latitude?.message}
          {...register('latitude')}
        />
        <TextField
          label="Longitude"
          hint="Decimal degrees; west is negative, e.g. -2.2"
          inputMode="decimal"
          autoComplete="off"
          error={errors.longitude?.message}
          {...register('longitude')}
        />
        <TextField
          label="Time zone"
          hint="Start typing a place name, e.g. Europe/London"
          list="site-form-time-zones"
          autoComplete="off"
          spellCheck={false}
          error={errors.timeZone?.message}
          {...register('timeZone')}
        />
        <TextField
          label={`Elevation (${units === 'us' ? 'ft' : 'm'} above sea level)`}
          hint={`Optional. Whole ${units === 'us' ? 'feet' : 'metres'}, e.g. ${units === 'us' ? '5400' : '60'}; kept to the metre.`}
          inputMode="numeric"
          autoComplete="off"
          error={errors.elevation?.message}
          {...register('elevation')}
        />
        <datalist id="site-form-time-zones">
          {timeZones.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
      </Group>

      <Group legend="Size and layout">
        <Select
          label="Units"
          hint="Lengths on this form, in the plot table and on the map use these units."
          error={errors.units?.message}
          {...unitsField}
          onChange={(event) => {
            const to = event.target.value as UnitSystem;
            switchUnits(units, to);
            void unitsField.onChange(event);
          }}
        >
          <option value="metric">Metres (metric)</option>
          <option value="us">Feet (US)</option>
        </Select>
        <div className="hidden sm:block" aria-hidden="true" />
        <TextField
          label={`Width, west to east (${unit})`}
          inputMode="decimal"
          autoComplete="off"
          error={errors.width?.message}
          {...register('width')}
        />
        <TextField
          label={`Length, north to south (${unit})`}
          inputMode="decimal"
          autoComplete="off"
          error={errors.length?.message}
          {...register('length')}
        />
        <TextField
          label={`Path width (${unit})`}
          hint="Plots at most this far apart count as neighbours across a path."
          inputMode="decimal"
          autoComplete="off"
          error={errors.pathWidth?.message}
          {...register('pathWidth')}
        />
        <TextField
          label={`Snapping grid (${unit})`}
          hint="Plots drawn on the map snap to this step; 0 turns snapping off."
          inputMode="decimal"
          autoComplete="off"
          error={errors.grid?.message}
          {...register('grid')}
        />
      </Group>

      <Group legend="Season and soil">
        <Controller
          control={control}
          name="lastSpringFrost"
          render={({ field, fieldState }) => (
            <MonthDayField
              legend="Last spring frost"
              hint="The usual date, any year."
              value={field.value}
              onChange={field.onChange}
              onBlur={field.onBlur}
              error={fieldState.error?.message}
            />
          )}
        />
        <Controller
          control={control}
          name="firstAutumnFrost"
          render={({ field, fieldState }) => (
            <MonthDayField
              legend="First autumn frost"
              hint="The usual date, any year."
              value={field.value}
              onChange={field.onChange}
              onBlur={field.onBlur}
              error={fieldState.error?.message}
            />
          )}
        />
        <SoilTempsField register={register} errors={errors} units={units} values={soilTemps} className="sm:col-span-2" />
        <TextAreaField label="Soil notes" hint="Optional. Soil type, tests, what was added." error={errors.soilNotes?.message} className="sm:col-span-2" rows={3} {...register('soilNotes')} />
      </Group>

      {/* Next to the button, so the answer shows where the person is looking on a long form. */}
      {formError && <Alert tone="error">{formError}</Alert>}
      {saved && <Alert tone="success">{saved}</Alert>}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" loading={pending} loadingText="Saving…">
          {site ? 'Save changes' : 'Add site'}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel} disabled={pending}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
