import { Circle } from 'lucide-react';
import type { FindingSeverity, Verdict } from '../lib/wording';
import { SeveritySymbol } from './severity-symbol';

export type MarkKind = FindingSeverity | Verdict;

/**
 * The neighbour check's marks in lists: the same shapes as on the map and in the findings table (an octagon
 * with a cross for a clash, a triangle for something to watch, a circle with a tick for a good pairing), and
 * an open ring for nothing found. Decorative: the words always stand beside them.
 */
export function FindingMark({ kind, className = 'size-5' }: { kind: MarkKind; className?: string }) {
  if (kind === 'fine') return <Circle className={`shrink-0 text-stone ${className}`} aria-hidden="true" />;
  return <SeveritySymbol severity={kind} className={className} />;
}
