import { getPosition } from 'suncalc';
import { describe, expect, it } from 'vitest';
import {
  noonElevationDeg,
  noonSunDirection,
  OVERHEAD_WITHIN_DEG,
  shadowDirection,
  shadowLengthM,
  shadowSideOf,
  solarNoon,
} from './sun';

const NOAA = 'NOAA Global Monitoring Laboratory, Solar Calculator';
const NOAA_TOLERANCE_DEG = 0.1;
const rad = (deg: number) => (deg * Math.PI) / 180;

// The sun's declination at the June and December solstices, ±23.44° (computed: the obliquity of
// the ecliptic); noon elevation = 90 − |latitude − declination| on those dates.
const DECLINATION_DEG = 23.44;
const noonElevationFromDeclination = (lat: number, dec: number) => 90 - Math.abs(lat - dec);

describe('suncalc 2.0.2 conventions (checked, since they changed between versions)', () => {
  it('gives degrees, azimuth clockwise from north: the London noon sun in June stands near 180° (south)', () => {
    const noon = solarNoon('2024-06-20', 51.5, -0.1);
    const p = getPosition(noon, 51.5, -0.1);
    // Degrees, not radians: a radian altitude could never exceed π/2.
    expect(p.altitude).toBeGreaterThan(60);
    expect(p.azimuth).toBeCloseTo(180, 0);
  });
  it('puts the morning sun in the east (about 90°) and the afternoon sun in the west (about 270°)', () => {
    const noon = solarNoon('2024-03-20', 0, 0).getTime();
    const morning = getPosition(new Date(noon - 3 * 3_600_000), 0, 0).azimuth;
    const afternoon = getPosition(new Date(noon + 3 * 3_600_000), 0, 0).azimuth;
    expect(morning).toBeGreaterThan(45);
    expect(morning).toBeLessThan(135);
    expect(afternoon).toBeGreaterThan(225);
    expect(afternoon).toBeLessThan(315);
  });
});

describe('solarNoon', () => {
  it('falls on the calendar date asked for, near 12:00 UTC at longitude 0', () => {
    const noon = solarNoon('2024-06-20', 51.5);
    expect(noon.toISOString().slice(0, 10)).toBe('2024-06-20');
    // The equation of time stays within about ±17 minutes (computed bound, used loosely).
    expect(Math.abs(noon.getTime() - Date.parse('2024-06-20T12:00:00Z'))).toBeLessThan(17 * 60_000);
  });
  it('comes 4 minutes of clock time earlier per degree east (computed: 24 h / 360°)', () => {
    const greenwich = solarNoon('2024-06-20', 51.5, 0).getTime();
    const east30 = solarNoon('2024-06-20', 51.5, 30).getTime();
    expect((greenwich - east30) / 60_000).toBeCloseTo(120, 0);
  });
  it('is Sydney’s local noon on the Sydney date (about 02:00 UTC at 151.2° E)', () => {
    const noon = solarNoon('2024-06-20', -33.9, 151.2);
    expect(noon.toISOString().slice(0, 13)).toBe('2024-06-20T01');
  });
  it('is the sun’s highest point: an hour either side it stands lower', () => {
    const noon = solarNoon('2024-12-21', 40, -75).getTime();
    const at = (t: number) => getPosition(new Date(t), 40, -75).altitude;
    expect(at(noon)).toBeGreaterThan(at(noon - 3_600_000));
    expect(at(noon)).toBeGreaterThan(at(noon + 3_600_000));
  });
});

describe('noonElevationDeg', () => {
  // [latitude, date, elevation°] — source: NOAA Global Monitoring Laboratory, Solar Calculator, ±0.1°.
  const noaa: [number, string, number][] = [
    [51.5, '2024-06-20', 61.94],
    [51.5, '2024-12-21', 15.06],
    [40, '2024-06-20', 73.44],
    [40, '2024-12-21', 26.56],
  ];
  it.each(noaa)(`${NOAA}: %s° N on %s, noon elevation %s°`, (lat, date, expected) => {
    expect(Math.abs(noonElevationDeg(date, lat) - expected)).toBeLessThanOrEqual(NOAA_TOLERANCE_DEG);
  });

  it('barely depends on longitude (computed with suncalc: under 0.01° across ±180° at a solstice)', () => {
    const at = (lng: number) => noonElevationDeg('2024-06-20', 51.5, lng);
    expect(Math.abs(at(-180) - at(0))).toBeLessThan(0.01);
    expect(Math.abs(at(180) - at(0))).toBeLessThan(0.01);
  });

  it('computed: 33.9° S on 2024-12-21 stands about 79.5° (90 − |−33.9 − (−23.44)|)', () => {
    const expected = noonElevationFromDeclination(-33.9, -DECLINATION_DEG); // 79.54
    expect(Math.abs(noonElevationDeg('2024-12-21', -33.9, 151.2) - expected)).toBeLessThan(0.2);
  });

  it('computed: 10° N on 2024-06-20 stands about 76.6° (90 − |10 − 23.44|)', () => {
    const expected = noonElevationFromDeclination(10, DECLINATION_DEG); // 76.56
    expect(Math.abs(noonElevationDeg('2024-06-20', 10) - expected)).toBeLessThan(0.2);
  });

  it('computed: is below the horizon at 80° N on 2024-12-21 (polar night: 90 − |80 + 23.44| < 0)', () => {
    expect(noonElevationFromDeclination(80, -DECLINATION_DEG)).toBeLessThan(0);
    expect(noonElevationDeg('2024-12-21', 80)).toBeLessThan(0);
  });
});

describe('noonSunDirection and shadowDirection', () => {
  it('computed: 51.5° N in June and December has the sun south (declination ±23.44° < 51.5°), shadows fall north', () => {
    for (const date of ['2024-06-20', '2024-12-21']) {
      expect(noonSunDirection(date, 51.5)).toBe('south');
      expect(shadowDirection(date, 51.5)).toBe('north');
    }
  });

  it('computed: 33.9° S (Sydney-like) on 2024-06-20 has the noon sun to the NORTH, so shadows fall south', () => {
    // In June the declination is +23.44°, north of −33.9°, so the noon sun stands north.
    expect(DECLINATION_DEG).toBeGreaterThan(-33.9);
    expect(noonSunDirection('2024-06-20', -33.9, 151.2)).toBe('north');
    expect(shadowDirection('2024-06-20', -33.9, 151.2)).toBe('south');
  });

  it('computed: 33.9° S on 2024-12-21 still has the sun north (declination −23.44° is north of −33.9°)', () => {
    expect(noonSunDirection('2024-12-21', -33.9, 151.2)).toBe('north');
  });

  it('computed: 10° N on 2024-06-20 has the sun north of overhead (declination 23.44° > 10°), shadows south', () => {
    expect(noonSunDirection('2024-06-20', 10)).toBe('north');
    expect(shadowDirection('2024-06-20', 10)).toBe('south');
  });

  it('computed: 10° N on 2024-12-21 has the sun south again (declination −23.44° < 10°)', () => {
    expect(noonSunDirection('2024-12-21', 10)).toBe('south');
    expect(shadowDirection('2024-12-21', 10)).toBe('north');
  });

  it(`computed: on the Tropic of Cancer (23.44° N) at the June solstice the sun is overhead (within ${OVERHEAD_WITHIN_DEG}°), no shadow side`, () => {
    expect(noonElevationDeg('2024-06-20', 23.44)).toBeGreaterThan(90 - OVERHEAD_WITHIN_DEG);
    expect(noonSunDirection('2024-06-20', 23.44)).toBe('overhead');
    expect(shadowDirection('2024-06-20', 23.44)).toBe('none');
    // A degree away it is no longer overhead.
    expect(noonSunDirection('2024-06-20', 22.4)).toBe('north');
    expect(noonSunDirection('2024-06-20', 24.5)).toBe('south');
  });

  it('puts the shadow away from the sun', () => {
    expect(shadowSideOf('south')).toBe('north');
    expect(shadowSideOf('north')).toBe('south');
    expect(shadowSideOf('overhead')).toBe('none');
  });
});

describe('shadowLengthM', () => {
  it('computed: a 2 m plant at 61.94° casts 1.07 m (2 / tan 61.94°)', () => {
    expect(shadowLengthM(2, 61.94)).toBeCloseTo(1.07, 2);
    expect(shadowLengthM(2, 61.94)).toBeCloseTo(2 / Math.tan(rad(61.94)), 10);
  });
  it('computed: equals the height at 45° and is longer as the sun drops (1 m at 15.06° → 3.72 m)', () => {
    expect(shadowLengthM(1.5, 45)).toBeCloseTo(1.5, 10);
    expect(shadowLengthM(1, 15.06)).toBeCloseTo(3.72, 2);
    expect(shadowLengthM(1, 15.06)).toBeGreaterThan(shadowLengthM(1, 61.94));
  });
  it('is 0 with the sun overhead or no height', () => {
    expect(shadowLengthM(2, 90)).toBe(0);
    expect(shadowLengthM(0, 30)).toBe(0);
  });
  it('throws a RangeError when the sun is at or below the horizon', () => {
    expect(() => shadowLengthM(2, 0)).toThrow(RangeError);
    expect(() => shadowLengthM(2, -5)).toThrow(/horizon/);
  });
  it('throws a RangeError for a negative height, an elevation past 90° or a non-number', () => {
    expect(() => shadowLengthM(-1, 30)).toThrow(RangeError);
    expect(() => shadowLengthM(1, 91)).toThrow(RangeError);
    expect(() => shadowLengthM(Number.NaN, 30)).toThrow(RangeError);
    expect(() => shadowLengthM(1, Number.NaN)).toThrow(RangeError);
  });
  it('with the 51.5° N June noon sun a 2 m plant casts about 1.07 m (NOAA elevation, computed shadow)', () => {
    expect(shadowLengthM(2, noonElevationDeg('2024-06-20', 51.5))).toBeCloseTo(1.07, 1);
  });
});

describe('bad input', () => {
  it.each(['', 'not a date', '2024-13-01', '2024-02-30', '2024-6-20', '2024-06-20T12:00:00Z', '20240620'])(
    'throws a RangeError for the date %j',
    (date) => {
      expect(() => solarNoon(date, 51.5)).toThrow(RangeError);
      expect(() => noonElevationDeg(date, 51.5)).toThrow(RangeError);
      expect(() => noonSunDirection(date, 51.5)).toThrow(RangeError);
    },
  );
  it('accepts 29 February in a leap year only', () => {
    expect(() => solarNoon('2024-02-29', 51.5)).not.toThrow();
    expect(() => solarNoon('2023-02-29', 51.5)).toThrow(RangeError);
  });
  it('throws a RangeError for a latitude or longitude off the globe', () => {
    expect(() => noonElevationDeg('2024-06-20', 91)).toThrow(RangeError);
    expect(() => noonElevationDeg('2024-06-20', Number.NaN)).toThrow(RangeError);
    expect(() => noonElevationDeg('2024-06-20', 51.5, 181)).toThrow(RangeError);
  });
});
