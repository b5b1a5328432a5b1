import type { PlotKind } from '../schemas/plots';

export interface SuggestPlot {
  kind: PlotKind;
  isAccessible: boolean;
  siteId: number;
}

export interface SuggestPerson {
  id: number;
  preferredSize: 'small' | 'medium' | 'large' | 'any';
  needsAccessible: boolean;
  needsRaised: boolean;
  preferredSiteId: number | null;
}

/** Whether the plot meets every need the person stated (an accessible bed, a raised bed, a site). */
export function meetsNeeds(person: SuggestPerson, plot: SuggestPlot): boolean {
  return (
    (!person.needsAccessible || plot.isAccessible) &&
    (!person.needsRaised || plot.kind === 'raised_bed') &&
    (person.preferredSiteId === null || person.preferredSiteId === plot.siteId)
  );
}

function sizeMatches(person: SuggestPerson, plot: SuggestPlot): boolean {
  if (person.preferredSize === 'any') return true;
  const smallKind = plot.kind === 'raised_bed' || plot.kind === 'container';
  return person.preferredSize === 'small' ? smallKind : !smallKind;
}

/**
 * The next person to offer a free plot to, from people in queue order: an accessible or raised
 * bed goes first to the earliest person who needs one; otherwise the earliest person whose
 * needs it meets and whose preferred size it suits; otherwise the earliest whose needs it meets.
 * A suggestion only: the coordinator decides.
 */
export function suggestApplicant<P extends SuggestPerson>(plot: SuggestPlot, queue: readonly P[]): P | null {
  const eligible = queue.filter((p) => meetsNeeds(p, plot));
  const special = eligible.find((p) => (plot.isAccessible && p.needsAccessible) || (plot.kind === 'raised_bed' && p.needsRaised));
  return special ?? eligible.find((p) => sizeMatches(p, plot)) ?? eligible[0] ?? null;
}
