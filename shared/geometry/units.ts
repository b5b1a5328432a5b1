// Lengths and areas are stored in SI (metres, square metres); US customary
// units exist only at the edge, for display and input.
//
// Exact definitions from NIST SP 811 (2008 edition), Appendix B, and NIST
// Handbook 44, Appendix C: 1 ft = 0.3048 m, 1 in = 0.0254 m (25.4 mm),
// 1 ft² = 0.09290304 m², all exact.

/** Metres in one international foot (exact). */
export const METRES_PER_FOOT = 0.3048;
/** Metres in one international inch (exact). */
export const METRES_PER_INCH = 0.0254;
/** Inches in one foot. */
export const INCHES_PER_FOOT = 12;
/** Square metres in one square foot (exact: 0.3048²). */
export const SQUARE_METRES_PER_SQUARE_FOOT = 0.09290304;
/** Feet in one metre (1 / 0.3048, not exact in binary or decimal). */
export const FEET_PER_METRE = 1 / METRES_PER_FOOT;
/** Square feet in one square metre. */
export const SQUARE_FEET_PER_SQUARE_METRE = 1 / SQUARE_METRES_PER_SQUARE_FOOT;

/** How lengths and areas are shown to a person; storage is always metric. */
export type UnitSystem = 'metric' | 'us';

/** The unit systems a site can display, for validation and pickers. */
export const unitSystems = ['metric', 'us'] as const satisfies readonly UnitSystem[];

/** Converts metres to feet. */
export function metresToFeet(m: number): number {
  // Dividing by the exact factor keeps 0.3048 m → 1 ft exact, which
  // multiplying by FEET_PER_METRE would not.
  return m / METRES_PER_FOOT;
}

/** Converts feet to metres. */
export function feetToMetres(ft: number): number {
  return ft * METRES_PER_FOOT;
}

/** Converts square metres to square feet. */
export function squareMetresToSquareFeet(m2: number): number {
  return m2 / SQUARE_METRES_PER_SQUARE_FOOT;
}

/** Converts square feet to square metres. */
export function squareFeetToSquareMetres(ft2: number): number {
  return ft2 * SQUARE_METRES_PER_SQUARE_FOOT;
}

/** Converts a stored length in metres to the number shown in the given unit system. */
export function toDisplayLength(m: number, units: UnitSystem): number {
  return units === 'us' ? metresToFeet(m) : m;
}

/** Converts a length typed in the given unit system back to metres for storage. */
export function fromDisplayLength(value: number, units: UnitSystem): number {
  return units === 'us' ? feetToMetres(value) : value;
}

/** Converts a stored area in square metres to the number shown in the given unit system. */
export function toDisplayArea(m2: number, units: UnitSystem): number {
  return units === 'us' ? squareMetresToSquareFeet(m2) : m2;
}

/** The short unit label for lengths in a unit system ("m" or "ft"). */
export function lengthUnitLabel(units: UnitSystem): string {
  return units === 'us' ? 'ft' : 'm';
}

/** The short unit label for areas in a unit system ("m²" or "ft²"). */
export function areaUnitLabel(units: UnitSystem): string {
  return units === 'us' ? 'ft²' : 'm²';
}

/** Rounds half away from zero to at most `decimals` places, without the 1.005 → 1.00 surprise. */
export function roundTo(value: number, decimals = 2): number {
  if (!Number.isFinite(value)) return value;
  // Twelve significant digits first: strips binary noise such as
  // 200.00000000000003 while keeping every digit a garden map can mean.
  const cleaned = Number(value.toPrecision(12));
  const abs = Math.abs(cleaned);
  if (abs * 10 ** decimals < 0.5) return 0;
  if (abs >= 1e15) return cleaned;
  const text = String(abs);
  if (text.includes('e')) {
    const factor = 10 ** decimals;
    return (cleaned < 0 ? -1 : 1) * (Math.round(abs * factor) / factor);
  }
  // Shifting the decimal point in the string form rounds what the person
  // sees (1.005 → 1.01); multiplying the double would round 1.00499999….
  const shifted = Math.round(Number(`${text}e${decimals}`));
  const rounded = Number(`${shifted}e-${decimals}`);
  return cleaned < 0 ? -rounded : rounded;
}

function formatNumber(value: number, decimals: number): string {
  // String() of a rounded double already drops trailing zeros ("3", "2.5").
  return String(roundTo(value, decimals));
}

/** Formats a stored length for display, e.g. "3 m", "2.5 m" or "10 ft" (at most two decimals). */
export function formatLength(m: number, units: UnitSystem, decimals = 2): string {
  return `${formatNumber(toDisplayLength(m, units), decimals)} ${lengthUnitLabel(units)}`;
}

/** Formats a stored area for display, e.g. "18 m²" or "200 ft²" (at most two decimals). */
export function formatArea(m2: number, units: UnitSystem, decimals = 2): string {
  return `${formatNumber(toDisplayArea(m2, units), decimals)} ${areaUnitLabel(units)}`;
}
