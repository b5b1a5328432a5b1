import { getPosition, getTimes } from 'suncalc';

// The noon sun for the neighbour check's shade rule: how high it stands, on which side, and how
// long a plant's shadow is. Pure code: suncalc (2.0.2) does the astronomy, no I/O.
//
// suncalc 2.x speaks degrees, with the azimuth clockwise from north (0 = N, 90 = E, 180 = S,
// 270 = W; node_modules/suncalc/index.d.ts and README). Version 1.x gave radians measured from
// south towards west (from memory), so the tests check the convention rather than trust it.
//
// Longitude: it moves the instant of solar noon (about 4 minutes of clock time per degree), but
// barely the noon elevation, which is 90° less the distance between the latitude and the sun's
// declination. Across the whole ±180° of longitude the noon instant of one calendar date shifts by
// under a day either way, and the declination changes by at most about 0.4° a day (near the
// equinoxes; almost nothing at the solstices), so the noon elevation moves by at most about 0.2°
// (computed with suncalc at 51.5° N: 38.47–38.87° on 2024-03-20, 61.945–61.948° on 2024-06-20).
// That is below what a plant height or a bed's measured distance can tell apart, so a site without
// a longitude may leave it at 0.

/** Within this many degrees of the zenith we say the sun stands overhead (our own rule, no outside source: the sun's disc is about half a degree across). */
export const OVERHEAD_WITHIN_DEG = 0.5;

export type SunSide = 'south' | 'north' | 'overhead';
export type ShadowSide = 'north' | 'south' | 'none';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Midday UTC of a calendar date `YYYY-MM-DD`, or a RangeError for anything else (2024-02-30 too). */
function middayUtc(dateIso: string): number {
  const m = ISO_DATE.exec(dateIso);
  if (!m) throw new RangeError(`Not a calendar date (YYYY-MM-DD): ${JSON.stringify(dateIso)}`);
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = Date.UTC(y, mo - 1, d, 12);
  const back = new Date(t);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d) {
    throw new RangeError(`No such calendar date: ${dateIso}`);
  }
  return t;
}

function checkPlace(latitude: number, longitude: number): void {
  if (!Number.isFinite(latitude) || latitude < -90 || latitude > 90) {
    throw new RangeError(`Latitude must be between -90 and 90 degrees, got ${latitude}`);
  }
  if (!Number.isFinite(longitude) || longitude < -180 || longitude > 180) {
    throw new RangeError(`Longitude must be between -180 and 180 degrees, got ${longitude}`);
  }
}

/**
 * The instant of solar noon (the sun at its highest) on the calendar date `dateIso` at the place.
 * suncalc gives the noon of the solar day containing the instant it is handed, so it is handed the
 * place's mean noon on that date (12:00 UTC less 4 minutes per degree east).
 */
export function solarNoon(dateIso: string, latitude: number, longitude = 0): Date {
  checkPlace(latitude, longitude);
  const localMeanNoon = middayUtc(dateIso) - (longitude / 15) * 3_600_000;
  return getTimes(new Date(localMeanNoon), latitude, longitude).solarNoon;
}

/** The sun at solar noon: apparent (refraction-corrected) elevation and azimuth, in degrees. */
function noonPosition(dateIso: string, latitude: number, longitude: number) {
  return getPosition(solarNoon(dateIso, latitude, longitude), latitude, longitude);
}

/** The sun's elevation above the horizon at solar noon, in degrees (negative in a polar night). */
export function noonElevationDeg(dateIso: string, latitude: number, longitude = 0): number {
  return noonPosition(dateIso, latitude, longitude).altitude;
}

/** Which side the noon sun stands on: south (azimuth 180°), north (azimuth 0°/360°), or overhead. */
export function noonSunDirection(dateIso: string, latitude: number, longitude = 0): SunSide {
  const { altitude, azimuth } = noonPosition(dateIso, latitude, longitude);
  if (altitude >= 90 - OVERHEAD_WITHIN_DEG) return 'overhead';
  // At noon the azimuth is 180° or 0°/360° up to rounding; east of north-south counts as its half.
  return azimuth > 90 && azimuth < 270 ? 'south' : 'north';
}

/**
 * Length of the shadow a plant of `heightM` casts on level ground with the sun at `elevationDeg`:
 * height / tan(elevation), in metres. A sun at or below the horizon casts no shadow one could
 * measure (the whole ground is in shade), so that is a RangeError for the caller to handle, not an
 * Infinity that would slip into a message; so are a negative height and an elevation above 90°.
 */
export function shadowLengthM(heightM: number, elevationDeg: number): number {
  if (!Number.isFinite(heightM) || heightM < 0) throw new RangeError(`Height must be 0 m or more, got ${heightM}`);
  if (!Number.isFinite(elevationDeg) || elevationDeg > 90) {
    throw new RangeError(`Sun elevation must be a number of degrees up to 90, got ${elevationDeg}`);
  }
  if (elevationDeg <= 0) {
    throw new RangeError(`The sun is at or below the horizon (${elevationDeg}°): no shadow length`);
  }
  if (elevationDeg === 90) return 0;
  return heightM / Math.tan((elevationDeg * Math.PI) / 180);
}

/** The side a shadow falls to, away from the sun: none when the sun is overhead. */
export function shadowSideOf(sun: SunSide): ShadowSide {
  if (sun === 'overhead') return 'none';
  return sun === 'south' ? 'north' : 'south';
}

/** Where a plant's noon shadow falls on that date at the place: north, south, or none. */
export function shadowDirection(dateIso: string, latitude: number, longitude = 0): ShadowSide {
  return shadowSideOf(noonSunDirection(dateIso, latitude, longitude));
}
