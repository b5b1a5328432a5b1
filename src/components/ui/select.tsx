import type { ComponentProps, ReactNode } from 'react';
import { Field, inputClasses } from './field';

export interface SelectProps extends Omit<ComponentProps<'select'>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  id?: string;
  /** Keep the label for screen readers only, for compact toolbars. */
  hideLabel?: boolean;
}

/** A labelled native select: native so phones show their own large picker. */
export function Select({ label, hint, error, id, hideLabel = false, className = '', children, ...rest }: SelectProps) {
  return (
    <Field
      label={hideLabel ? <span className="sr-only">{label}</span> : label}
      hint={hint}
      error={error}
      id={id}
      className={className}
    >
      {({ inputId, describedBy, invalid }) => (
        <select
          id={inputId}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={`${inputClasses} cursor-pointer pr-8 disabled:cursor-not-allowed disabled:bg-paper-100`}
          {...rest}
        >
          {children}
        </select>
      )}
    </Field>
  );
}
