import { useId } from 'react';
import { Select } from '@/components/ui/select';
import { daysInMonth, monthOptions } from '../lib/month-day';

export interface MonthDayFieldProps {
  legend: string;
  hint?: string;
  /** "MM-DD", "" for not set, or a half-picked "04-" / "-25" while the person is choosing. */
  value: string;
  onChange: (value: string) => void;
  onBlur?: () => void;
  error?: string;
}

/** A day of the year with no year (a typical frost date): a month picker and a day picker. */
export function MonthDayField({ legend, hint, value, onChange, onBlur, error }: MonthDayFieldProps) {
  const ids = useId();
  const [month = '', day = ''] = value.split('-');
  const days = daysInMonth(month);
  const hintId = hint ? `${ids}-hint` : undefined;
  const errorId = error ? `${ids}-error` : undefined;

  const emit = (nextMonth: string, nextDay: string) => {
    // A day the new month does not have (31 in April) is dropped rather than silently moved.
    const keptDay = nextDay && Number(nextDay) > daysInMonth(nextMonth) ? '' : nextDay;
    onChange(nextMonth || keptDay ? `${nextMonth}-${keptDay}` : '');
  };

  return (
    <fieldset
      aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
      aria-invalid={error ? true : undefined}
      className="min-w-0"
    >
      <legend className="mb-1.5 font-medium text-soil">{legend}</legend>
      {hint && (
        <p id={hintId} className="mb-1.5 text-sm text-stone">
          {hint}
        </p>
      )}
      <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-3">
        <Select
          label={
            <>
              <span className="sr-only">{legend} </span>
              <span className="text-sm">Month</span>
            </>
          }
          value={month}
          onChange={(event) => emit(event.target.value, day)}
          onBlur={onBlur}
          aria-invalid={error ? true : undefined}
        >
          <option value="">Not set</option>
          {monthOptions.map((m) => (
            <option key={m.value} value={m.value}>
              {m.label}
            </option>
          ))}
        </Select>
        <Select
          label={
            <>
              <span className="sr-only">{legend} </span>
              <span className="text-sm">Day</span>
            </>
          }
          value={day}
          onChange={(event) => emit(month, event.target.value)}
          onBlur={onBlur}
          aria-invalid={error ? true : undefined}
        >
          <option value="">–</option>
          {Array.from({ length: days }, (_, i) => String(i + 1).padStart(2, '0')).map((d) => (
            <option key={d} value={d}>
              {Number(d)}
            </option>
          ))}
        </Select>
      </div>
      {error && (
        <p id={errorId} className="mt-1.5 text-sm font-medium text-clay-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
