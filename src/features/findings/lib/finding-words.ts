import type { FindingView } from '@shared/schemas/findings';

export type Severity = FindingView['severity'];
export type Kind = FindingView['kind'];

/** The order findings are read in: what needs acting on first. */
export const severityOrder: Severity[] = ['clash', 'watch', 'good'];

/** One word (or two) per severity, as every screen names it. */
export const severityLabels: Record<Severity, string> = { clash: 'Clash', watch: 'Watch', good: 'Good pairing' };

/** "1 clash", "3 to watch", "2 good pairings". */
export function severityCount(severity: Severity, n: number): string {
  if (severity === 'clash') return n === 1 ? '1 clash' : `${n} clashes`;
  if (severity === 'watch') return `${n} to watch`;
  return n === 1 ? '1 good pairing' : `${n} good pairings`;
}

export const kindLabels: Record<Kind, string> = {
  rotation: 'Rotation',
  companion: 'Neighbours',
  shade: 'Shade',
  site_fit: 'Fit for the place',
};

const evidenceLabels: Record<string, string> = {
  published: 'published',
  computed: 'computed by Tillwell',
  common_practice: 'common practice',
  from_memory: 'from memory',
  research: 'research',
};

/** How sure the source is, in words: "published", "common practice", … (an unknown kind is shown as sent). */
export function evidenceLabel(evidence: string): string {
  return evidenceLabels[evidence] ?? evidence.replace(/_/g, ' ');
}

/** Counts of each severity in a list of findings. */
export function countBySeverity(findings: Pick<FindingView, 'severity'>[]): Record<Severity, number> {
  const counts: Record<Severity, number> = { clash: 0, watch: 0, good: 0 };
  for (const f of findings) counts[f.severity] += 1;
  return counts;
}

/** "2 clashes, 1 to watch" (the severities present, worst first), or "nothing found". */
export function countsSentence(counts: Record<Severity, number>): string {
  const parts = severityOrder.filter((s) => counts[s] > 0).map((s) => severityCount(s, counts[s]));
  return parts.length ? parts.join(', ') : 'nothing found';
}

const CAUTION_WORDS = /\b(spray|sprays|sprayed|chemical|chemicals|pesticide|herbicide|fungicide|lime|limed|liming|manure|fertili[sz]er|fertili[sz]ers|slug pellets?)\b/i;

/**
 * The usual caution for a finding whose words mention sprays, chemicals, lime, manure or
 * fertiliser (common practice), or null when they mention none.
 */
export function cautionFor(...texts: string[]): string | null {
  return texts.some((t) => CAUTION_WORDS.test(t))
    ? 'Before using any spray, lime, manure or fertiliser, read and follow the product label, wear what it asks for, keep to local rules, and ask a licensed adviser when unsure.'
    : null;
}
