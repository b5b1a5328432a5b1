import { roundTo, type UnitSystem } from '@shared/geometry';
import { usGallonsFromLitres } from '@shared/water/units';

// The server sends water in litres; a US site reads US gallons (1 US gallon = 3.785411784 L exactly,
// NIST Handbook 44, Appendix C; the conversion lives in shared/water/units).

/** The water a shift carries in the site's units: "45 litres", "12 US gallons", "1 litre"; null when the shift waters nothing. */
export function waterText(amountL: number | null, units: UnitSystem): string | null {
  if (amountL === null) return null;
  const value = units === 'us' ? usGallonsFromLitres(amountL) : amountL;
  // Whole units from 10 up, one decimal below, as a can or a hose meter is read.
  const n = String(roundTo(value, Math.abs(value) >= 10 ? 0 : 1));
  if (units === 'us') return `${n} ${n === '1' ? 'US gallon' : 'US gallons'}`;
  return `${n} ${n === '1' ? 'litre' : 'litres'}`;
}
