import type { FindingView, WhatFitsResult } from '@shared/schemas/findings';

export type FindingSeverity = FindingView['severity'];
export type Verdict = WhatFitsResult['items'][number]['verdict'];
type FindingPeer = FindingView['peers'][number];

/** Severity in words, always shown beside its mark so colour is never the only signal. */
export const severityWords: Record<FindingSeverity, string> = {
  clash: 'Clash',
  watch: 'Watch',
  good: 'Good pairing',
};

/** The what-fits verdict in words. */
export const verdictWords: Record<Verdict, string> = {
  good: 'Good choice',
  fine: 'Nothing against it',
  watch: 'Possible, with care',
  clash: 'Clashes here',
};

export const kindWords: Record<FindingView['kind'], string> = {
  rotation: 'Rotation',
  companion: 'Neighbours',
  shade: 'Shade',
  site_fit: 'Soil and weather',
};

const evidence: Record<string, string> = {
  published: 'published source',
  common_practice: 'common practice',
  from_memory: 'from memory',
  research: 'research',
  computed: 'computed',
};

/** How sure the source behind a finding is, in words; an evidence level we do not know is shown as it is. */
export function evidenceWords(level: string): string {
  return evidence[level] ?? level.replace(/_/g, ' ');
}

const severityOrder: Record<FindingSeverity, number> = { clash: 0, watch: 1, good: 2 };

/** Clashes first, then what to watch, then good pairings; the server's order is kept within each. */
export function sortFindings<T extends Pick<FindingView, 'severity'>>(findings: readonly T[]): T[] {
  return findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => severityOrder[a.f.severity] - severityOrder[b.f.severity] || a.i - b.i)
    .map(({ f }) => f);
}

/** "1 clash, 2 to watch and 1 good pairing"; an empty string when there are none. */
export function findingCounts(findings: readonly Pick<FindingView, 'severity'>[]): string {
  const n = (s: FindingSeverity) => findings.filter((f) => f.severity === s).length;
  const parts: string[] = [];
  const clash = n('clash');
  const watch = n('watch');
  const good = n('good');
  if (clash) parts.push(`${clash} ${clash === 1 ? 'clash' : 'clashes'}`);
  if (watch) parts.push(`${watch} to watch`);
  if (good) parts.push(`${good} good ${good === 1 ? 'pairing' : 'pairings'}`);
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** Whether any finding is a clash (a planting with one needs a reason to be kept). */
export function hasClash(findings: readonly Pick<FindingView, 'severity'>[]): boolean {
  return findings.some((f) => f.severity === 'clash');
}

/** Another planting a finding names: "Potato on this plot, 2025" or "Broad bean on plot B4, 2026". */
export function peerText(peer: FindingPeer, finding: Pick<FindingView, 'plotId'>): string {
  const where = peer.plotId === finding.plotId ? 'this plot' : `plot ${peer.plotLabel}`;
  return `${peer.cropName} on ${where}, ${peer.seasonYear}`;
}

export interface FindingGroup<F> {
  plantingId: number;
  /** The planting's name as the plot book says it, or the crop named in the finding when the planting is not listed. */
  name: string;
  findings: F[];
}

/**
 * Findings grouped by the planting they are about, in the order the plantings are listed; findings about a planting
 * not in the list come last under the crop they name. Each group is sorted clashes first.
 */
export function groupByPlanting<F extends Pick<FindingView, 'plantingId' | 'cropName' | 'severity'>>(
  findings: readonly F[],
  plantings: readonly { id: number; name: string }[],
): FindingGroup<F>[] {
  const groups = new Map<number, FindingGroup<F>>();
  for (const p of plantings) groups.set(p.id, { plantingId: p.id, name: p.name, findings: [] });
  for (const f of findings) {
    let group = groups.get(f.plantingId);
    if (!group) {
      group = { plantingId: f.plantingId, name: f.cropName, findings: [] };
      groups.set(f.plantingId, group);
    }
    group.findings.push(f);
  }
  return [...groups.values()].filter((g) => g.findings.length > 0).map((g) => ({ ...g, findings: sortFindings(g.findings) }));
}

/** An error as one line: its message and any field messages the server gave (a 400 on a date out of range, say). */
export function errorText(error: { message: string; fields?: Record<string, string> }): string {
  const fields = Object.values(error.fields ?? {}).filter((m) => m !== error.message);
  return [error.message, ...fields].join(' ');
}
