import { SQUARE_METRES_PER_SQUARE_FOOT } from '../geometry/units';

// Depths of water and their volumes. Depths are kept in millimetres and volumes in litres; inches and
// US gallons exist only at the edge, for display.
//
// Exact definitions, NIST Handbook 44, Appendix C: 1 inch = 2.54 centimeters; 1 gallon (US) = 231
// cubic inches. So 1 US gallon = 231 × 2.54³ cm³ = 3785.411784 cm³ = 3.785411784 L exactly (computed).
// 1 L = 1 dm³, so 1 mm of water over 1 m² is 0.001 m × 1 m² = 1 dm³ = 1 L (computed).

/** Millimetres in one inch (exact: 1000 × 0.0254). */
export const MM_PER_INCH = 25.4;
/** Cubic inches in one US gallon (exact, NIST Handbook 44 Appendix C). */
export const CUBIC_INCHES_PER_US_GALLON = 231;
/** Litres in one US gallon (exact: 231 in³ × 0.016387064 L/in³ = 3.785411784 L). */
export const LITRES_PER_US_GALLON = 3.785411784;

function finite(value: number, what: string): number {
  if (!Number.isFinite(value)) throw new RangeError(`${what} must be a finite number, got ${value}`);
  return value;
}

/** Litres of water that cover `areaM2` square metres to a depth of `mm` millimetres: 1 mm over 1 m² = 1 L. */
export function litresFor(mm: number, areaM2: number): number {
  if (finite(areaM2, 'Area') < 0) throw new RangeError(`Area must not be negative, got ${areaM2}`);
  if (finite(mm, 'Depth') < 0) throw new RangeError(`Depth must not be negative, got ${mm}`);
  return mm * areaM2;
}

/** Litres → US gallons (1 US gal = 3.785411784 L exactly). */
export function usGallonsFromLitres(l: number): number {
  return finite(l, 'Volume') / LITRES_PER_US_GALLON;
}

/** US gallons → litres. */
export function litresFromUsGallons(gal: number): number {
  return finite(gal, 'Volume') * LITRES_PER_US_GALLON;
}

/** Millimetres of water → inches (dividing by the exact factor keeps 25.4 mm → 1 in exact). */
export function inchesFromMm(mm: number): number {
  return finite(mm, 'Depth') / MM_PER_INCH;
}

/** Inches of water → millimetres. */
export function mmFromInches(inches: number): number {
  return finite(inches, 'Depth') * MM_PER_INCH;
}

/** US gallons that cover `areaFt2` square feet to `inches` inches (through litres; 1 in over 1 ft² = 144/231 gal). */
export function usGallonsFor(inches: number, areaFt2: number): number {
  return usGallonsFromLitres(litresFor(mmFromInches(inches), areaFt2 * SQUARE_METRES_PER_SQUARE_FOOT));
}
