import { lengthUnitLabel, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import { formatMonthDay } from './month-day';

/** A width and length in one unit, e.g. "34 × 22 m" or "84 × 60 ft". */
export function formatSize(width: number, length: number, units: UnitSystem): string {
  const show = (m: number) => String(roundTo(toDisplayLength(m, units), 2));
  return `${show(width)} × ${show(length)} ${lengthUnitLabel(units)}`;
}

/** The frost-free window as "25 Apr – 20 Oct", with "not set" for a missing end; null when neither is set. */
export function formatFrostDates(lastSpring: string | null, firstAutumn: string | null): string | null {
  const spring = formatMonthDay(lastSpring);
  const autumn = formatMonthDay(firstAutumn);
  if (!spring && !autumn) return null;
  return `${spring ?? 'not set'} – ${autumn ?? 'not set'}`;
}

/** How a unit system is named in tables. */
export const unitsLabels: Record<UnitSystem, string> = { metric: 'Metric (m)', us: 'US (ft)' };
