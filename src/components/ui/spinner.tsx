import { LoaderCircle } from 'lucide-react';

/** A spinning ring; decorative, so pair it with text. */
export function Spinner({ className = 'size-6' }: { className?: string }) {
  return <LoaderCircle className={`animate-spin text-leaf ${className}`} aria-hidden="true" />;
}

/** A centred spinner with a label that screen readers announce politely. */
export function LoadingState({ label = 'Loading…', fullPage = false }: { label?: string; fullPage?: boolean }) {
  return (
    <div
      role="status"
      className={`flex items-center justify-center gap-3 text-stone ${fullPage ? 'min-h-dvh' : 'py-12'}`}
    >
      <Spinner />
      <span>{label}</span>
    </div>
  );
}
