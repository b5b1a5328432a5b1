import { LoaderCircle } from 'lucide-react';

/** A spinning ring; decorative, so pair it with text. */
export function Spinner({ className = 'size-6' }: { className?: string }) {
  return <LoaderCircle className={`animate-spin text-leaf ${className}`} aria-hidden="true" />;
}

/**
 * A spinner with a label that screen readers announce politely: centred in the space it loads into, or `inline`
 * as one line inside a card or below a table that is loading more.
 */
export function LoadingState({ label = 'Loading…', fullPage = false, inline = false }: { label?: string; fullPage?: boolean; inline?: boolean }) {
  return (
    <div
      role="status"
      className={inline ? 'flex items-center gap-2 text-stone' : `flex items-center justify-center gap-3 text-stone ${fullPage ? 'min-h-dvh' : 'py-12'}`}
    >
      <Spinner className={inline ? 'size-5' : undefined} />
      <span>{label}</span>
    </div>
  );
}
