import { roundTo, type UnitSystem } from '@shared/geometry';

// Water is stored in millimetres of depth and litres of volume; US sites read inches and US gallons.
// Exact definitions from NIST Handbook 44, Appendix C (General Tables of Units of Measurement):
// 1 inch = 2.54 cm = 25.4 mm exactly, and 1 US gallon = 231 cubic inches = 3.785411784 litres exactly.

/** Millimetres in one inch (exact, NIST Handbook 44, Appendix C). */
export const MM_PER_INCH = 25.4;
/** Litres in one US liquid gallon (exact: 231 in³ × 16.387064 cm³, NIST Handbook 44, Appendix C). */
export const LITRES_PER_US_GALLON = 3.785411784;

/** Depth of water: millimetres to inches. */
export function mmToInches(mm: number): number {
  return mm / MM_PER_INCH;
}

/** Volume of water: litres to US gallons. */
export function litresToUsGallons(litres: number): number {
  return litres / LITRES_PER_US_GALLON;
}

/** A depth in the number a person on the site reads: mm on metric sites, inches on US sites. */
export function depthIn(mm: number, units: UnitSystem): number {
  return units === 'us' ? mmToInches(mm) : mm;
}

/** A volume in the number a person on the site reads: litres on metric sites, US gallons on US sites. */
export function volumeIn(litres: number, units: UnitSystem): number {
  return units === 'us' ? litresToUsGallons(litres) : litres;
}

/** "mm" or "in". */
export function depthUnit(units: UnitSystem): string {
  return units === 'us' ? 'in' : 'mm';
}

/** "litres" or "US gallons", for column headings. */
export function volumeUnitWords(units: UnitSystem): string {
  return units === 'us' ? 'US gallons' : 'litres';
}

/** The depth as a bare number, rounded as a watering can is read: whole mm from 10 mm, else one place; inches to two places. */
export function depthNumber(mm: number, units: UnitSystem): string {
  if (units === 'us') return String(roundTo(mmToInches(mm), 2));
  return String(roundTo(mm, Math.abs(mm) >= 10 ? 0 : 1));
}

/** The volume as a bare number: whole units from 10, else one place. */
export function volumeNumber(litres: number, units: UnitSystem): string {
  const v = volumeIn(litres, units);
  return String(roundTo(v, Math.abs(v) >= 10 ? 0 : 1));
}

/** "12 mm" or "0.47 in". */
export function formatDepth(mm: number, units: UnitSystem): string {
  return `${depthNumber(mm, units)} ${depthUnit(units)}`;
}

/** "45 litres" or "11.9 US gallons" ("1 litre", "1 US gallon"). */
export function formatVolume(litres: number, units: UnitSystem): string {
  const n = volumeNumber(litres, units);
  const one = n === '1';
  if (units === 'us') return `${n} ${one ? 'US gallon' : 'US gallons'}`;
  return `${n} ${one ? 'litre' : 'litres'}`;
}

/** A water task's amount as one line: "12 mm, 45 litres"; either part alone when only one is known; null when neither. */
export function formatWaterAmount(amountMm: number | null, amountL: number | null, units: UnitSystem): string | null {
  const parts = [amountMm === null ? null : formatDepth(amountMm, units), amountL === null ? null : formatVolume(amountL, units)].filter(
    (p): p is string => p !== null,
  );
  return parts.length ? parts.join(', ') : null;
}
