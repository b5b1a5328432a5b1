import type { ComponentProps } from 'react';
import { LoaderCircle } from 'lucide-react';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'ghost';

const base =
  'inline-flex min-h-11 items-center justify-center gap-2 rounded-lg px-4 py-2 text-base font-semibold no-underline ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-leaf text-white hover:bg-leaf-700 active:bg-leaf-800',
  secondary: 'border border-stone bg-white text-soil hover:bg-paper-100',
  danger: 'bg-clay text-white hover:bg-clay-700',
  ghost: 'text-soil hover:bg-paper-200',
};

/** Class names for anything that should look like a button, such as a router Link. */
export function buttonClasses(variant: ButtonVariant = 'primary', extra = ''): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

export interface ButtonProps extends ComponentProps<'button'> {
  variant?: ButtonVariant;
  /** Shows a spinner, blocks clicks and tells assistive tech the action is running. */
  loading?: boolean;
  loadingText?: string;
}

/** The one button: 44 px tall at least, four variants, and a loading state. */
export function Button({
  variant = 'primary',
  loading = false,
  loadingText,
  className = '',
  disabled,
  children,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, className)}
      disabled={disabled || loading}
      aria-busy={loading || undefined}
      {...rest}
    >
      {loading && <LoaderCircle className="size-5 animate-spin" aria-hidden="true" />}
      {loading && loadingText ? loadingText : children}
    </button>
  );
}
