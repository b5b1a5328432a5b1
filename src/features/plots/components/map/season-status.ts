import type { PlotSeasonState, PlotSeasonStatus } from '@shared/schemas/seasons';
import { initials } from './map-math';

// Fill and a word say a plot's season status, so it reads without colour too.
export const statusClasses: Record<PlotSeasonStatus, string> = {
  free: 'bg-white',
  renewal_pending: 'bg-paper-200',
  offered: 'bg-straw',
  taken: 'bg-shoot-100',
};

/** The short word shown on a plot for its status: "free", "offered", "renewal?", the holder's initials, or "club" for a shared bed. */
export function statusWord(status: PlotSeasonStatus, who: string | null, kind?: string): string {
  if (kind === 'shared_bed' && status === 'free') return 'club';
  if (status === 'taken') return initials(who ?? '');
  return status === 'free' ? 'free' : status === 'offered' ? 'offered' : 'renewal?';
}

/**
 * A plot's accessible name: it starts with the words shown on the plot (so speech and sight
 * agree), then says the rest: "Plot A-1 TL, held by Teodor Lind", "Plot B-1 offered, to Ines Carvalho".
 */
export function plotName(label: string, status: PlotSeasonStatus | null, who: string | null, kind?: string): string {
  if (status === null) return `Plot ${label}`;
  const word = statusWord(status, who, kind);
  if (status === 'taken') return `Plot ${label} ${word}, held by ${who ?? 'someone'}`;
  if (status === 'offered') return `Plot ${label} ${word}, to ${who ?? 'someone'}`;
  if (status === 'renewal_pending') return `Plot ${label} ${word}, waiting for ${who ?? 'the holder'} to keep or give it up`;
  return kind === 'shared_bed' ? `Plot ${label} ${word}, a shared bed` : `Plot ${label} ${word}`;
}

/** Who a plot's season status is about: the holder, else the person offered it, else the one asked to renew. */
export function seasonPerson(state: Pick<PlotSeasonState, 'holder' | 'offer' | 'renewal'> | undefined): string | null {
  return state?.holder?.name ?? state?.offer?.name ?? state?.renewal?.name ?? null;
}
