import { checkDraft, prepare } from './check';
import type { CheckContext, CheckPlanting, Finding, PartRect } from './types';

export type FitVerdict = 'good' | 'fine' | 'watch' | 'clash';

export interface FitItem {
  cropId: number;
  verdict: FitVerdict;
  /** Higher is better: a good pairing adds, a watch takes off more, a clash much more. */
  score: number;
  findings: Finding[];
}

/** Weights of the ranking: any clash sinks a crop below every watch, any watch below every good pairing. */
export const FIT_WEIGHTS = { clash: -100, watch: -10, good: 5 } as const;

const verdictOrder: Record<FitVerdict, number> = { good: 0, fine: 1, watch: 2, clash: 3 };

/**
 * Every crop of the club's catalogue tried on a plot (or part of it) on a sowing date, by the same
 * rules as a planting, best first: good pairings, then nothing against, then watches, then clashes;
 * within each by score, then by name.
 */
export function whatFits(ctx: CheckContext, opts: { plotId: number; seasonYear: number; part: PartRect | null; date: string }): FitItem[] {
  const pr = prepare(ctx);
  const items: Array<FitItem & { name: string }> = [];
  for (const crop of ctx.crops.values()) {
    const draft: CheckPlanting = {
      id: 0,
      plotId: opts.plotId,
      seasonYear: opts.seasonYear,
      cropId: crop.id,
      part: opts.part,
      method: crop.data.sowing.value === 'transplant' ? 'transplanted' : 'sown',
      plantedOn: opts.date,
      status: 'planned',
    };
    const findings = checkDraft(pr, draft);
    const score = findings.reduce((sum, f) => sum + FIT_WEIGHTS[f.severity], 0);
    const verdict: FitVerdict = findings.some((f) => f.severity === 'clash')
      ? 'clash'
      : findings.some((f) => f.severity === 'watch')
        ? 'watch'
        : findings.some((f) => f.severity === 'good')
          ? 'good'
          : 'fine';
    items.push({ cropId: crop.id, verdict, score, findings, name: crop.data.commonName });
  }
  items.sort((a, b) => verdictOrder[a.verdict] - verdictOrder[b.verdict] || b.score - a.score || a.name.localeCompare(b.name));
  return items.map(({ name: _name, ...item }) => item);
}
