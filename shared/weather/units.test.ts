import { describe, expect, it } from 'vitest';
import { boundsIn, crossFieldProblems, rangeProblem, storedSi, weatherQuantity } from './quantities';
import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatWeather,
  inchesToMm,
  METRES_PER_SECOND_PER_MPH,
  metresPerSecondToMph,
  MM_PER_INCH,
  mmToInches,
  mphToMetresPerSecond,
  toDisplayWeather,
  weatherFromSi,
  weatherToSi,
} from './units';

// NIST SP 811 (2008 edition), Appendix B.8: inch = 2.54 E-02 m, foot = 3.048 E-01 m, mile per hour =
// 4.4704 E-01 m/s, each exact; Appendix B.9: t/°C = (t/°F − 32)/1.8. NIST Handbook 44, Appendix C:
// 1 inch = 2.54 centimeters exactly, 1 mile = 1.609 344 kilometers exactly.
describe('weather unit factors', () => {
  it('uses the exact inch: 1.00 in of rain is 25.4 mm', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(inchesToMm(1)).toBe(25.4);
    expect(mmToInches(25.4)).toBe(1);
    // computed: 0.05 in × 25.4 = 1.27 mm, the rain gauge's US step
    expect(inchesToMm(0.05)).toBe(1.27);
    // computed: 0.01 in × 25.4 = 0.254 mm, the finest reading of a US gauge (common practice)
    expect(inchesToMm(0.01)).toBeCloseTo(0.254, 12);
  });

  it('uses the exact mile per hour: 1 mph = 0.44704 m/s (1609.344 m / 3600 s)', () => {
    expect(METRES_PER_SECOND_PER_MPH).toBe(0.44704);
    expect(1609.344 / 3600).toBeCloseTo(METRES_PER_SECOND_PER_MPH, 15);
    expect(mphToMetresPerSecond(10)).toBeCloseTo(4.4704, 12);
    expect(metresPerSecondToMph(0.44704)).toBe(1);
  });

  it('converts Fahrenheit exactly at the fixed points: 32 °F = 0 °C, 212 °F = 100 °C, 50 °F = 10 °C', () => {
    expect(fahrenheitToCelsius(32)).toBe(0);
    expect(fahrenheitToCelsius(212)).toBe(100);
    expect(fahrenheitToCelsius(50)).toBe(10);
    // computed: (−40 − 32)/1.8 = −40, where the two scales meet
    expect(fahrenheitToCelsius(-40)).toBe(-40);
    expect(celsiusToFahrenheit(10)).toBe(50);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
  });

  it('leaves metric values, humidity, hours and solar radiation as they are', () => {
    expect(weatherToSi('rain', 12.3, 'metric')).toBe(12.3);
    expect(weatherToSi('percent', 55, 'us')).toBe(55);
    expect(weatherToSi('hours', 6.5, 'us')).toBe(6.5);
    expect(weatherToSi('solar', 18.2, 'us')).toBe(18.2);
    // computed: 6.5 ft × 0.3048 = 1.9812 m
    expect(weatherToSi('height', 6.5, 'us')).toBeCloseTo(1.9812, 12);
    expect(weatherFromSi('height', 1.9812, 'us')).toBeCloseTo(6.5, 12);
  });
});

describe('weather values as people read them', () => {
  it('shows rain to 0.1 mm or 0.01 in and temperatures to 0.1 degree', () => {
    expect(formatWeather('rain', 12.345, 'metric')).toBe('12.3 mm');
    // computed: 12.7 mm / 25.4 = 0.5 in
    expect(formatWeather('rain', 12.7, 'us')).toBe('0.5 in');
    expect(formatWeather('temperature', 10, 'us')).toBe('50 °F');
    // computed: 18.5 × 1.8 + 32 = 65.3 °F
    expect(toDisplayWeather('temperature', 18.5, 'us')).toBe(65.3);
    expect(formatWeather('percent', 54.4, 'metric')).toBe('54 %');
  });

  it('stores a typed value at the column precision and checks the bound on what is stored', () => {
    // computed: 51 °F → 10.5556 °C → kept to 0.01 °C
    expect(storedSi(weatherQuantity.tMinC, 51, 'us')).toBe(10.56);
    expect(storedSi(weatherQuantity.rainMm, 0.01, 'us')).toBe(0.254);
    // computed: 60 °C × 1.8 + 32 = 140 °F is the top; −60 °C = −76 °F the bottom
    expect(boundsIn(weatherQuantity.tMaxC, 'us')).toEqual({ min: -76, max: 140 });
    expect(rangeProblem(weatherQuantity.tMaxC, 140, 'us')).toBeNull();
    expect(rangeProblem(weatherQuantity.tMaxC, 141, 'us')).toBe('At most 140 °F');
    expect(rangeProblem(weatherQuantity.rainMm, -0.01, 'metric')).toBe('At least 0 mm');
    expect(rangeProblem(weatherQuantity.windHeightM, 1, 'us')).toBe('At least 1.64 ft');
  });

  it('names the value that breaks the order of the day', () => {
    expect(crossFieldProblems({ tMinC: 12, tMaxC: 8 })).toEqual({ tMinC: 'The lowest temperature is above the highest' });
    expect(crossFieldProblems({ tMinC: 8, tMaxC: 8, rhMinPct: 40, rhMaxPct: 90, rhMeanPct: 65 })).toEqual({});
    expect(crossFieldProblems({ rhMinPct: 40, rhMaxPct: 90, rhMeanPct: 95 })).toEqual({
      rhMeanPct: 'The mean humidity is outside the lowest and highest',
    });
  });
});

describe('the CSV columns', () => {
  it('are the date and then each quantity in the table order', async () => {
    const { weatherCsvColumns } = await import('../schemas/weather');
    const { weatherQuantities } = await import('./quantities');
    expect(weatherCsvColumns).toEqual(['date', ...weatherQuantities.map((q) => q.csv)]);
  });
});
