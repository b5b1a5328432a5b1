import { useId, type ComponentProps, type ReactNode } from 'react';

export interface CheckboxProps extends Omit<ComponentProps<'input'>, 'type'> {
  label: ReactNode;
  hint?: ReactNode;
}

/** A checkbox whose whole row is the touch target. */
export function Checkbox({ label, hint, id, className = '', ...rest }: CheckboxProps) {
  const autoId = useId();
  const inputId = id ?? `checkbox-${autoId}`;
  const hintId = hint ? `${inputId}-hint` : undefined;
  return (
    <div className={`flex min-h-11 items-start gap-3 rounded-lg py-2 ${className}`}>
      <input
        id={inputId}
        type="checkbox"
        aria-describedby={hintId}
        className="mt-0.5 size-5 shrink-0 cursor-pointer accent-leaf"
        {...rest}
      />
      <label htmlFor={inputId} className="-my-2 min-h-11 flex-1 cursor-pointer py-2">
        <span className="font-medium">{label}</span>
        {hint && (
          <span id={hintId} className="block text-sm text-stone">
            {hint}
          </span>
        )}
      </label>
    </div>
  );
}

export interface CheckboxGroupProps {
  legend: ReactNode;
  error?: string;
  children: ReactNode;
}

/** A fieldset of checkboxes with one legend and one error message for the group. */
export function CheckboxGroup({ legend, error, children }: CheckboxGroupProps) {
  const errorId = useId();
  return (
    <fieldset aria-describedby={error ? errorId : undefined} aria-invalid={error ? true : undefined}>
      <legend className="mb-1 font-medium">{legend}</legend>
      <div className="flex flex-col">{children}</div>
      {error && (
        <p id={errorId} className="mt-1 text-sm font-medium text-clay-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
