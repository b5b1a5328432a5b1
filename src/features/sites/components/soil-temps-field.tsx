import { useId } from 'react';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import type { UnitSystem } from '@shared/geometry';
import { inputClasses } from '@/components/ui/field';
import { monthOptions } from '../lib/month-day';
import { SOIL_TEMPS_INCOMPLETE, soilTempFieldNames, type SiteFormValues } from '../lib/site-form';
import { temperatureUnitLabel } from '../lib/soil-temps';

const shortMonth = new Intl.DateTimeFormat('en-GB', { month: 'short', timeZone: 'UTC' });
const months = monthOptions.map((m, i) => ({ ...m, short: shortMonth.format(Date.UTC(2028, i, 1)) }));

export interface SoilTempsFieldProps {
  register: UseFormRegister<SiteFormValues>;
  errors: FieldErrors<SiteFormValues>;
  units: UnitSystem;
  /** The twelve texts as typed, to mark the empty months when some are filled. */
  values: readonly string[];
  className?: string;
}

/** Twelve monthly soil temperatures, January first, in °C or °F by the site's units. */
export function SoilTempsField({ register, errors, units, values, className = '' }: SoilTempsFieldProps) {
  const ids = useId();
  const unit = temperatureUnitLabel(units);
  const hintId = `${ids}-hint`;
  const error = errors.soilTemps?.message ?? errors.soilTemps?.root?.message;
  const errorId = error ? `${ids}-error` : undefined;
  const incomplete = error === SOIL_TEMPS_INCOMPLETE;

  return (
    <fieldset
      aria-describedby={[hintId, errorId].filter(Boolean).join(' ')}
      aria-invalid={error ? true : undefined}
      className={`min-w-0 ${className}`}
    >
      <legend className="mb-1.5 font-medium text-soil">Soil temperature by month ({unit})</legend>
      <p id={hintId} className="mb-3 max-w-prose text-sm text-stone">
        Typical soil temperature at sowing depth (about 5–10 cm) in each month. Sowing is checked against each crop&apos;s
        germination minimum. Leave all empty if you do not know them.
      </p>
      {/* Three across on a phone, more on wider screens: twelve boxes never push the page sideways. */}
      <div className="grid grid-cols-3 gap-x-3 gap-y-4 sm:grid-cols-4 lg:grid-cols-6">
        {months.map((month, i) => {
          const name = soilTempFieldNames[i];
          const own = errors.soilTemps?.[i]?.message;
          const inputId = `${ids}-${month.value}`;
          const ownErrorId = own ? `${inputId}-error` : undefined;
          const invalid = Boolean(own) || (incomplete && (values[i] ?? '').trim() === '');
          return (
            <div key={month.value} className="flex min-w-0 flex-col gap-1">
              <label htmlFor={inputId} className="text-sm font-medium text-soil">
                <span aria-hidden="true">{month.short}</span>
                <span className="sr-only">
                  {month.label}, {unit}
                </span>
              </label>
              <input
                id={inputId}
                type="text"
                // No inputMode: the decimal keypad on some phones has no minus sign, and winter soil can be below 0.
                autoComplete="off"
                spellCheck={false}
                aria-invalid={invalid || undefined}
                aria-describedby={[ownErrorId, errorId].filter(Boolean).join(' ') || undefined}
                className={inputClasses}
                {...register(name)}
              />
              {own && (
                <p id={ownErrorId} className="text-sm font-medium text-clay-700">
                  {own}
                </p>
              )}
            </div>
          );
        })}
      </div>
      {error && (
        <p id={errorId} className="mt-2 text-sm font-medium text-clay-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
