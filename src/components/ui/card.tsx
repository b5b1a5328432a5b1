import type { ComponentProps } from 'react';

/** A white panel on the paper background. */
export function Card({ className = '', ...rest }: ComponentProps<'div'>) {
  return <div className={`rounded-xl border border-paper-200 bg-white p-5 shadow-sm sm:p-6 ${className}`} {...rest} />;
}
