import type { WaitlistEntry } from '@shared/schemas/applications';
import { plural } from '@/lib/format';


/** How long someone has waited, in the unit people use: days, then weeks, then months, then years and months. */
export function formatWaited(days: number): string {
  if (days === 0) return 'Since today';
  if (days < 14) return plural(days, 'day');
  if (days < 61) return plural(Math.floor(days / 7), 'week');
  // An average month and year, to the day (common practice for "about how long").
  const months = Math.floor(days / 30.44);
  if (months < 12) return plural(months, 'month');
  const years = Math.floor(days / 365.25);
  const rest = Math.floor((days - years * 365.25) / 30.44);
  return rest > 0 ? `${plural(years, 'year')} ${plural(rest, 'month')}` : plural(years, 'year');
}

export const sizeShortLabels: Record<WaitlistEntry['preferredSize'], string> = {
  small: 'Small',
  medium: 'Medium',
  large: 'Large',
  any: 'Any',
};

/** The needs someone gave, as short words for badges and sorting. */
export function needsOf(e: Pick<WaitlistEntry, 'needsRaised' | 'needsAccessible'>): string[] {
  return [...(e.needsAccessible ? ['Accessible bed'] : []), ...(e.needsRaised ? ['Raised bed'] : [])];
}
