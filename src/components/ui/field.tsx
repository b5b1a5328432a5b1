import { useId, type ComponentProps, type ReactNode } from 'react';

interface FieldIds {
  inputId: string;
  describedBy: string | undefined;
  invalid: boolean;
}

export interface FieldProps {
  label: ReactNode;
  /** Helpful text under the label, read out with the input. */
  hint?: ReactNode;
  error?: string;
  id?: string;
  className?: string;
  children: (ids: FieldIds) => ReactNode;
}

/** Label, control, hint and error text wired together with ids and aria-describedby. */
export function Field({ label, hint, error, id, className = '', children }: FieldProps) {
  const autoId = useId();
  const inputId = id ?? `field-${autoId}`;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={inputId} className="font-medium text-soil">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-stone">
          {hint}
        </p>
      )}
      {children({ inputId, describedBy, invalid: Boolean(error) })}
      {error && (
        <p id={errorId} className="text-sm font-medium text-clay-700">
          {error}
        </p>
      )}
    </div>
  );
}

/** Shared look for text inputs and selects: 44 px tall, visible border, red when invalid. */
export const inputClasses =
  'min-h-11 w-full rounded-lg border border-stone bg-white px-3 py-2 text-base text-soil ' +
  'placeholder:text-stone aria-[invalid=true]:border-2 aria-[invalid=true]:border-clay-700';

export interface TextFieldProps extends Omit<ComponentProps<'input'>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  id?: string;
}

/** A labelled text input; pass react-hook-form's register() result straight in. */
export function TextField({ label, hint, error, id, className = '', ...inputProps }: TextFieldProps) {
  return (
    <Field label={label} hint={hint} error={error} id={id} className={className}>
      {({ inputId, describedBy, invalid }) => (
        <input
          id={inputId}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={inputClasses}
          {...inputProps}
        />
      )}
    </Field>
  );
}

export interface TextAreaFieldProps extends Omit<ComponentProps<'textarea'>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  id?: string;
  /** Classes for the surrounding field (grid placement); `textareaClassName` styles the box itself. */
  className?: string;
  textareaClassName?: string;
}

/** A labelled multi-line text box; pass react-hook-form's register() result straight in. */
export function TextAreaField({ label, hint, error, id, className = '', textareaClassName = '', rows = 3, ...rest }: TextAreaFieldProps) {
  return (
    <Field label={label} hint={hint} error={error} id={id} className={className}>
      {({ inputId, describedBy, invalid }) => (
        <textarea
          id={inputId}
          rows={rows}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={`${inputClasses} ${textareaClassName}`.trim()}
          {...rest}
        />
      )}
    </Field>
  );
}
