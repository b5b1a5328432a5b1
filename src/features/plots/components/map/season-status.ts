import type { PlotSeasonStatus } from '@shared/schemas/seasons';
import { initials } from './map-math';

// Fill and a word say a plot's season status, so it reads without colour too.
export const statusClasses: Record<PlotSeasonStatus, string> = {
  free: 'bg-white',
  renewal_pending: 'bg-paper-200',
  offered: 'bg-straw',
  taken: 'bg-shoot-100',
};

/** The short word shown on a plot for its status: "free", "offered", "renewal?" or the holder's initials. */
export function statusWord(status: PlotSeasonStatus, who: string | null): string {
  if (status === 'taken') return initials(who ?? '');
  return status === 'free' ? 'free' : status === 'offered' ? 'offered' : 'renewal?';
}
