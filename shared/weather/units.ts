import { METRES_PER_FOOT, roundTo, type UnitSystem } from '../geometry/units';

// Weather is stored and sent in SI (°C, mm, m/s, m, h, MJ/m², % RH); US units (°F, inches, mph, feet)
// exist only at the edge, for display, forms and CSV files. Exact definitions:
// - NIST SP 811 (2008 edition), Appendix B.8: inch = 2.54 E-02 m, foot = 3.048 E-01 m,
//   mile per hour = 4.4704 E-01 m/s, all exact; B.9 (temperature): t/°C = (t/°F − 32)/1.8.
// - NIST Handbook 44, Appendix C: 1 inch = 2.54 centimeters and 1 mile = 1.609 344 kilometers, exactly
//   (so 1 mph = 1609.344 m / 3600 s = 0.44704 m/s).

/** Millimetres in one inch (exact). */
export const MM_PER_INCH = 25.4;
/** Metres per second in one mile per hour (exact). */
export const METRES_PER_SECOND_PER_MPH = 0.44704;
/** Degrees Fahrenheit in one degree Celsius of difference (exact). */
export const FAHRENHEIT_PER_CELSIUS = 1.8;
/** The Fahrenheit reading of 0 °C. */
export const FAHRENHEIT_AT_ZERO_CELSIUS = 32;

/** °F → °C (NIST SP 811 B.9: t/°C = (t/°F − 32)/1.8). */
export function fahrenheitToCelsius(f: number): number {
  return (f - FAHRENHEIT_AT_ZERO_CELSIUS) / FAHRENHEIT_PER_CELSIUS;
}

/** °C → °F (t/°F = 1.8 × t/°C + 32). */
export function celsiusToFahrenheit(c: number): number {
  return c * FAHRENHEIT_PER_CELSIUS + FAHRENHEIT_AT_ZERO_CELSIUS;
}

/** Inches of rain → millimetres. */
export function inchesToMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/** Millimetres of rain → inches (dividing by the exact factor keeps 25.4 mm → 1 in exact). */
export function mmToInches(mm: number): number {
  return mm / MM_PER_INCH;
}

/** Miles per hour → metres per second. */
export function mphToMetresPerSecond(mph: number): number {
  return mph * METRES_PER_SECOND_PER_MPH;
}

/** Metres per second → miles per hour. */
export function metresPerSecondToMph(ms: number): number {
  return ms / METRES_PER_SECOND_PER_MPH;
}

/** Feet → metres, for a wind sensor's height. */
export function feetToMetresHeight(ft: number): number {
  return ft * METRES_PER_FOOT;
}

/** The kinds of weather value, each with its SI unit and, where it differs, its US unit. */
export type WeatherKind = 'temperature' | 'rain' | 'percent' | 'speed' | 'height' | 'hours' | 'solar';

const labels: Record<WeatherKind, Record<UnitSystem, string>> = {
  temperature: { metric: '°C', us: '°F' },
  rain: { metric: 'mm', us: 'in' },
  percent: { metric: '%', us: '%' },
  speed: { metric: 'm/s', us: 'mph' },
  height: { metric: 'm', us: 'ft' },
  hours: { metric: 'h', us: 'h' },
  // Solar radiation is MJ/m² in both: the unit FAO-56 works in.
  solar: { metric: 'MJ/m²', us: 'MJ/m²' },
};

/** The short unit of a kind of value in a unit system ("°F", "mm", "mph"). */
export function weatherUnitLabel(kind: WeatherKind, units: UnitSystem): string {
  return labels[kind][units];
}

/** A value typed or read in `units` as the SI value stored (°F → °C, in → mm, mph → m/s, ft → m). */
export function weatherToSi(kind: WeatherKind, value: number, units: UnitSystem): number {
  if (units === 'metric') return value;
  switch (kind) {
    case 'temperature':
      return fahrenheitToCelsius(value);
    case 'rain':
      return inchesToMm(value);
    case 'speed':
      return mphToMetresPerSecond(value);
    case 'height':
      return feetToMetresHeight(value);
    default:
      return value;
  }
}

/** A stored SI value in `units` (°C → °F, mm → in, m/s → mph, m → ft). */
export function weatherFromSi(kind: WeatherKind, value: number, units: UnitSystem): number {
  if (units === 'metric') return value;
  switch (kind) {
    case 'temperature':
      return celsiusToFahrenheit(value);
    case 'rain':
      return mmToInches(value);
    case 'speed':
      return metresPerSecondToMph(value);
    case 'height':
      return value / METRES_PER_FOOT;
    default:
      return value;
  }
}

/** Decimals a value is shown with: rain to 0.1 mm or 0.01 in, temperatures to 0.1°, humidity whole. */
export function weatherDisplayDecimals(kind: WeatherKind, units: UnitSystem): number {
  if (kind === 'rain') return units === 'us' ? 2 : 1;
  if (kind === 'percent') return 0;
  return 1;
}

/** A stored value as the number shown in `units`, rounded for reading. */
export function toDisplayWeather(kind: WeatherKind, value: number, units: UnitSystem): number {
  return roundTo(weatherFromSi(kind, value, units), weatherDisplayDecimals(kind, units));
}

/** "12 mm", "0.45 in", "18.5 °C", "54 %": a stored value with its unit, in `units`. */
export function formatWeather(kind: WeatherKind, value: number, units: UnitSystem): string {
  return `${toDisplayWeather(kind, value, units)} ${weatherUnitLabel(kind, units)}`;
}
