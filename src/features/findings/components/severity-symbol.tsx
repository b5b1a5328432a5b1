import { CircleCheck, OctagonX, TriangleAlert } from 'lucide-react';
import { severityLabels, type Severity } from '../lib/finding-words';

// Each severity has its own shape (octagon, triangle, circle) as well as its colour, so it reads in grey too.
const icons = { clash: OctagonX, watch: TriangleAlert, good: CircleCheck } as const;
const iconClasses: Record<Severity, string> = {
  clash: 'text-clay-700 fill-clay-50',
  watch: 'text-soil fill-straw',
  good: 'text-leaf fill-leaf-50',
};

/** The severity's shape alone, for places that say the word beside it (or name it another way). */
export function SeveritySymbol({ severity, className = 'size-4' }: { severity: Severity; className?: string }) {
  const Icon = icons[severity];
  return <Icon className={`shrink-0 ${iconClasses[severity]} ${className}`} aria-hidden="true" />;
}

/** The severity's shape and its word: "⯃ Clash". */
export function SeverityTag({ severity }: { severity: Severity }) {
  return (
    <span className="inline-flex items-center gap-1.5 font-medium whitespace-nowrap">
      <SeveritySymbol severity={severity} />
      {severityLabels[severity]}
    </span>
  );
}
