import type { FindingSeverity, Verdict } from '../lib/wording';

export type MarkKind = FindingSeverity | Verdict;

const colour: Record<MarkKind, string> = {
  clash: 'text-clay-700',
  watch: 'text-soil',
  good: 'text-leaf',
  fine: 'text-stone',
};

/**
 * The neighbour check's own marks, drawn so they differ in shape as well as colour: a solid square for a clash,
 * an open triangle for something to watch, a ring with a plus for a good pairing, an open ring for nothing found.
 * Decorative: the words always stand beside them.
 */
export function FindingMark({ kind, className = 'size-5' }: { kind: MarkKind; className?: string }) {
  return (
    <svg viewBox="0 0 20 20" aria-hidden="true" focusable="false" className={`shrink-0 ${colour[kind]} ${className}`}>
      {kind === 'clash' && <rect x="3" y="3" width="14" height="14" rx="1.5" fill="currentColor" />}
      {kind === 'watch' && <path d="M10 2.8 18 17H2Z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />}
      {kind === 'good' && (
        <>
          <circle cx="10" cy="10" r="7.5" fill="none" stroke="currentColor" strokeWidth="2" />
          <path d="M10 6v8M6 10h8" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
        </>
      )}
      {kind === 'fine' && <circle cx="10" cy="10" r="6.5" fill="none" stroke="currentColor" strokeWidth="2" />}
    </svg>
  );
}
