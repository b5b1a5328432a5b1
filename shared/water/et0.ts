import { roundTo } from '../geometry/units';

// Reference evapotranspiration (ET0) of one day, pure code with no I/O.
//
// Every equation below is from FAO Irrigation and Drainage Paper 56, "Crop evapotranspiration —
// Guidelines for computing crop water requirements" (Allen, Pereira, Raes, Smith, 1998), named by its
// equation number. Units are FAO-56's: °C, kPa, m s⁻¹, MJ m⁻² d⁻¹, mm d⁻¹, metres above sea level.
// The equations and their numbers are those of our check-value table, except the numbers of Eq. 9
// (mean temperature), Eq. 20 (0.408 mm per MJ m⁻²) and Eq. 22 (degrees to radians) and the 273.16 K
// offset of Eq. 39, which are from memory.
//
// Which method a day gets depends on what its weather log holds:
// - FAO-56 Penman-Monteith (Eq. 6) when the day has Tmin, Tmax, humidity, wind and radiation;
// - Hargreaves (Eq. 52) when it has Tmin and Tmax only (or any of the others is missing: wind and
//   humidity are never guessed);
// - otherwise the rule of thumb of about 25 mm (1 inch) of water a week, rain included, which is not
//   a computation at all (see RULE_OF_THUMB_MM_PER_WEEK).

/** One day of a site's weather log, SI units. */
export interface WeatherDay {
  /** YYYY-MM-DD. */
  date: string;
  tMinC: number | null;
  tMaxC: number | null;
  rainMm: number | null;
  rhMinPct?: number | null;
  rhMaxPct?: number | null;
  rhMeanPct?: number | null;
  windMs?: number | null;
  /** Height the wind was measured at, m; 2 m when not given (FAO-56's standard height). */
  windHeightM?: number | null;
  /** Bright sunshine hours n. */
  sunshineH?: number | null;
  /** Measured solar radiation Rs, MJ m⁻² d⁻¹. */
  solarMjM2?: number | null;
}

export interface SiteClimate {
  /** Decimal degrees, north positive, south negative. */
  latitude: number;
  /** Metres above sea level; null when the site has not said (sea level is then assumed). */
  elevationM: number | null;
}

export type Et0Method = 'penman_monteith' | 'hargreaves' | 'rule_of_thumb';

export interface Et0Result {
  /** Reference evapotranspiration, mm per day. */
  mm: number;
  method: Et0Method;
  /** Plain words: what was used and what was assumed. */
  note: string;
  /** The intermediate values, by name (e.g. `ra`, `rn`, `u2`), in FAO-56's units. */
  parts?: Record<string, number>;
}

/** Solar constant Gsc, MJ m⁻² min⁻¹ (FAO-56 Eq. 21). */
export const SOLAR_CONSTANT = 0.082;
/** Stefan-Boltzmann constant σ, MJ K⁻⁴ m⁻² d⁻¹ (FAO-56 Eq. 39). */
export const STEFAN_BOLTZMANN = 4.903e-9;
/** Albedo α of the hypothetical grass reference crop (FAO-56 Eq. 38). */
export const REFERENCE_ALBEDO = 0.23;
/** Ångström coefficients as and bs where no calibration exists (FAO-56 Eq. 35). */
export const ANGSTROM_A = 0.25;
export const ANGSTROM_B = 0.5;
/** MJ m⁻² d⁻¹ → mm d⁻¹ of evaporation equivalent (FAO-56 Eq. 20: 1 / λ = 1 / 2.45 = 0.408). */
export const MM_PER_MJ = 0.408;
/** FAO-56's standard height for wind speed, m. */
export const STANDARD_WIND_HEIGHT_M = 2;

/**
 * About 25 mm (1 inch) of water a week, rain included: UF/IFAS Gardening Solutions ("half-inch to one
 * inch every week"), Purdue Landscape Report "What is an Inch of Water?", University of Minnesota
 * Extension. A rule of thumb, not a computation; used only when the log has no temperatures.
 */
export const RULE_OF_THUMB_MM_PER_WEEK = 25;
/** The rule of thumb spread evenly over a week: 25 / 7 mm (computed). */
export const RULE_OF_THUMB_MM_PER_DAY = RULE_OF_THUMB_MM_PER_WEEK / 7;

const toKelvin = (c: number) => c + 273.16; // FAO-56 Eq. 39 writes K = °C + 273.16
const degreesToRadians = (deg: number) => (Math.PI / 180) * deg; // FAO-56 Eq. 22

/** Mean daily air temperature, °C: (Tmax + Tmin) / 2 (FAO-56 Eq. 9). */
export function meanTemperature(tMinC: number, tMaxC: number): number {
  return (tMaxC + tMinC) / 2;
}

/** Atmospheric pressure P, kPa, at elevation z m: 101.3 ((293 − 0.0065 z) / 293)^5.26 (FAO-56 Eq. 7). */
export function atmosphericPressure(elevationM: number): number {
  return 101.3 * ((293 - 0.0065 * elevationM) / 293) ** 5.26;
}

/** Psychrometric constant γ, kPa °C⁻¹: 0.665 × 10⁻³ P (FAO-56 Eq. 8). */
export function psychrometricConstant(pressureKPa: number): number {
  return 0.665e-3 * pressureKPa;
}

/** Saturation vapour pressure e°(T), kPa, at air temperature T °C: 0.6108 exp(17.27 T / (T + 237.3)) (FAO-56 Eq. 11). */
export function saturationVapourPressure(tC: number): number {
  return 0.6108 * Math.exp((17.27 * tC) / (tC + 237.3));
}

/** Mean saturation vapour pressure es, kPa: (e°(Tmax) + e°(Tmin)) / 2 (FAO-56 Eq. 12). */
export function meanSaturationVapourPressure(tMinC: number, tMaxC: number): number {
  return (saturationVapourPressure(tMaxC) + saturationVapourPressure(tMinC)) / 2;
}

/** Slope Δ of the saturation vapour pressure curve, kPa °C⁻¹, at T °C (the mean): 4098 e°(T) / (T + 237.3)² (FAO-56 Eq. 13). */
export function slopeOfVapourPressureCurve(tMeanC: number): number {
  return (4098 * saturationVapourPressure(tMeanC)) / (tMeanC + 237.3) ** 2;
}

/** Humidity a day's log can give, in per cent. */
export type Humidity = { rhMaxPct: number; rhMinPct: number } | { rhMeanPct: number };

/**
 * Actual vapour pressure ea, kPa.
 * With RHmax and RHmin: (e°(Tmin) RHmax/100 + e°(Tmax) RHmin/100) / 2 (FAO-56 Eq. 17);
 * with RHmean only: RHmean/100 × (e°(Tmax) + e°(Tmin)) / 2 (FAO-56 Eq. 19).
 */
export function actualVapourPressure(tMinC: number, tMaxC: number, humidity: Humidity): number {
  if ('rhMaxPct' in humidity) {
    return (saturationVapourPressure(tMinC) * (humidity.rhMaxPct / 100) + saturationVapourPressure(tMaxC) * (humidity.rhMinPct / 100)) / 2;
  }
  return (humidity.rhMeanPct / 100) * meanSaturationVapourPressure(tMinC, tMaxC);
}

/** Day of the year J, 1 (1 January) to 365 or 366 (31 December), of a YYYY-MM-DD date. */
export function dayOfYear(isoDate: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!match) throw new RangeError(`Not a calendar date: ${isoDate}`);
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const t = Date.UTC(y, m - 1, d);
  const back = new Date(t);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== m - 1 || back.getUTCDate() !== d) throw new RangeError(`Not a calendar date: ${isoDate}`);
  return (t - Date.UTC(y, 0, 1)) / 86_400_000 + 1;
}

/** Inverse relative distance Earth-Sun dr: 1 + 0.033 cos(2π J / 365) (FAO-56 Eq. 23). */
export function inverseRelativeDistance(dayOfYearJ: number): number {
  return 1 + 0.033 * Math.cos(((2 * Math.PI) / 365) * dayOfYearJ);
}

/** Solar declination δ, rad: 0.409 sin(2π J / 365 − 1.39) (FAO-56 Eq. 24). */
export function solarDeclination(dayOfYearJ: number): number {
  return 0.409 * Math.sin(((2 * Math.PI) / 365) * dayOfYearJ - 1.39);
}

/**
 * Sunset hour angle ωs, rad: arccos(−tan φ tan δ) (FAO-56 Eq. 25). Beyond the polar circles the
 * argument leaves [−1, 1] on days of midnight sun or polar night; it is held at the bound, so ωs is
 * π (sun all day) or 0 (no sun), which is what the equation means there.
 */
export function sunsetHourAngle(latitudeRad: number, declinationRad: number): number {
  const x = -Math.tan(latitudeRad) * Math.tan(declinationRad);
  return Math.acos(Math.min(1, Math.max(-1, x)));
}

/** The astronomy of one day at one latitude (FAO-56 Eq. 21-25). */
export interface SunOnDay {
  dr: number;
  declinationRad: number;
  sunsetHourAngleRad: number;
  /** Extraterrestrial radiation Ra, MJ m⁻² d⁻¹. */
  ra: number;
}

function checkLatitude(latitude: number): void {
  if (!Number.isFinite(latitude) || Math.abs(latitude) > 90) throw new RangeError(`Latitude must be between −90 and 90 degrees, got ${latitude}`);
}

/**
 * Extraterrestrial radiation Ra, MJ m⁻² d⁻¹, from latitude (decimal degrees, south negative) and day
 * of year: (24 × 60 / π) Gsc dr [ωs sin φ sin δ + cos φ cos δ sin ωs] (FAO-56 Eq. 21, with φ in
 * radians by Eq. 22, dr Eq. 23, δ Eq. 24, ωs Eq. 25).
 */
export function extraterrestrialRadiation(latitude: number, dayOfYearJ: number): SunOnDay {
  checkLatitude(latitude);
  const phi = degreesToRadians(latitude);
  const dr = inverseRelativeDistance(dayOfYearJ);
  const delta = solarDeclination(dayOfYearJ);
  const ws = sunsetHourAngle(phi, delta);
  const ra =
    ((24 * 60) / Math.PI) * SOLAR_CONSTANT * dr * (ws * Math.sin(phi) * Math.sin(delta) + Math.cos(phi) * Math.cos(delta) * Math.sin(ws));
  // At the poles cos φ is 6e-17, not 0, and polar night can leave −1e-17: no radiation is below zero.
  return { dr, declinationRad: delta, sunsetHourAngleRad: ws, ra: Math.max(0, ra) };
}

/** Daylight hours N: 24 ωs / π (FAO-56 Eq. 34). */
export function daylightHours(sunsetHourAngleRad: number): number {
  return (24 / Math.PI) * sunsetHourAngleRad;
}

/** Solar radiation Rs, MJ m⁻² d⁻¹, from sunshine hours: (as + bs n / N) Ra with as 0.25, bs 0.50 (FAO-56 Eq. 35). */
export function solarRadiationFromSunshine(sunshineH: number, daylightH: number, ra: number): number {
  if (daylightH <= 0) return ANGSTROM_A * ra; // no day (polar night): Ra is 0 as well
  return (ANGSTROM_A + (ANGSTROM_B * sunshineH) / daylightH) * ra;
}

/** Clear-sky solar radiation Rso, MJ m⁻² d⁻¹: (0.75 + 2 × 10⁻⁵ z) Ra (FAO-56 Eq. 37). */
export function clearSkyRadiation(elevationM: number, ra: number): number {
  return (0.75 + 2e-5 * elevationM) * ra;
}

/** Net shortwave radiation Rns, MJ m⁻² d⁻¹: (1 − α) Rs with α = 0.23 for the grass reference (FAO-56 Eq. 38). */
export function netShortwave(rs: number): number {
  return (1 - REFERENCE_ALBEDO) * rs;
}

/**
 * Net outgoing longwave radiation Rnl, MJ m⁻² d⁻¹:
 * σ [(Tmax,K⁴ + Tmin,K⁴) / 2] (0.34 − 0.14 √ea) (1.35 Rs / Rso − 0.35) (FAO-56 Eq. 39).
 * Rs / Rso is limited to ≤ 1.0, as Eq. 39 says. Where Rso is 0 (polar night) the ratio cannot be
 * formed and is taken as 1 (our own choice; no garden grows there then).
 */
export function netLongwave(tMinC: number, tMaxC: number, ea: number, rs: number, rso: number): number {
  const ratio = rso > 0 ? Math.min(1, rs / rso) : 1;
  const t4 = (toKelvin(tMaxC) ** 4 + toKelvin(tMinC) ** 4) / 2;
  return STEFAN_BOLTZMANN * t4 * (0.34 - 0.14 * Math.sqrt(ea)) * (1.35 * ratio - 0.35);
}

/** Net radiation Rn, MJ m⁻² d⁻¹: Rns − Rnl (FAO-56 Eq. 40, with Rns from Eq. 38). */
export function netRadiation(rs: number, rnl: number): number {
  return netShortwave(rs) - rnl;
}

/**
 * Wind speed at 2 m, m s⁻¹, from uz measured z m above ground: uz × 4.87 / ln(67.8 z − 5.42)
 * (FAO-56 Eq. 47). The logarithm needs z above about 0.1 m; lower heights are refused. At the
 * standard 2 m the speed is returned as measured: Eq. 47's rounded constants give 1.0002 there, not 1.
 */
export function windAt2m(windMs: number, heightM: number): number {
  if (!(heightM > 0.1)) throw new RangeError(`Wind height must be above 0.1 m, got ${heightM}`);
  if (heightM === STANDARD_WIND_HEIGHT_M) return windMs;
  return (windMs * 4.87) / Math.log(67.8 * heightM - 5.42);
}

/**
 * Monthly soil heat flux G, MJ m⁻² d⁻¹. With the next month known: 0.07 (T month i+1 − T month i−1)
 * (FAO-56 Eq. 43); without it: 0.14 (T month i − T month i−1) (FAO-56 Eq. 44). Temperatures are the
 * months' mean air temperatures, °C. For a single day G is taken as 0 (FAO-56 Eq. 42).
 */
export function soilHeatFluxMonthly(t: { previousC: number; thisC: number; nextC?: number | null }): number {
  if (t.nextC != null) return 0.07 * (t.nextC - t.previousC);
  return 0.14 * (t.thisC - t.previousC);
}

/** What Penman-Monteith needs, already worked out (FAO-56 units). */
export interface PenmanMonteithParts {
  /** Slope Δ, kPa °C⁻¹ (Eq. 13). */
  delta: number;
  /** Psychrometric constant γ, kPa °C⁻¹ (Eq. 8). */
  gamma: number;
  /** Net radiation Rn, MJ m⁻² d⁻¹ (Eq. 40). */
  rn: number;
  /** Soil heat flux G, MJ m⁻² d⁻¹: 0 for a day (Eq. 42), Eq. 43/44 for a month. */
  g: number;
  /** Mean air temperature at 2 m, °C (Eq. 9). */
  tMeanC: number;
  /** Wind speed at 2 m, m s⁻¹ (Eq. 47). */
  u2: number;
  /** Saturation vapour pressure es, kPa (Eq. 12). */
  es: number;
  /** Actual vapour pressure ea, kPa (Eq. 17/19). */
  ea: number;
}

/**
 * FAO-56 Penman-Monteith reference evapotranspiration ET0, mm d⁻¹ (FAO-56 Eq. 6):
 * [0.408 Δ (Rn − G) + γ (900 / (T + 273)) u2 (es − ea)] / [Δ + γ (1 + 0.34 u2)].
 */
export function penmanMonteith(p: PenmanMonteithParts): number {
  const radiationTerm = MM_PER_MJ * p.delta * (p.rn - p.g);
  const aeroTerm = p.gamma * (900 / (p.tMeanC + 273)) * p.u2 * (p.es - p.ea);
  return (radiationTerm + aeroTerm) / (p.delta + p.gamma * (1 + 0.34 * p.u2));
}

/**
 * Hargreaves reference evapotranspiration ET0, mm d⁻¹ (FAO-56 Eq. 52):
 * 0.0023 (Tmean + 17.8) (Tmax − Tmin)^0.5 Ra, with Ra in mm d⁻¹ (0.408 × MJ m⁻² d⁻¹, Eq. 20).
 * Ra is given here in MJ m⁻² d⁻¹ and converted.
 */
export function hargreaves(tMinC: number, tMaxC: number, raMj: number): number {
  if (tMaxC < tMinC) throw new RangeError(`Tmax (${tMaxC}) is below Tmin (${tMinC})`);
  return 0.0023 * (meanTemperature(tMinC, tMaxC) + 17.8) * Math.sqrt(tMaxC - tMinC) * (MM_PER_MJ * raMj);
}

// ---- Choosing the method for a day -------------------------------------------------------------

const present = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);
const percent = (v: number | null | undefined): v is number => present(v) && v >= 0 && v <= 100;

const round = (v: number, decimals: number) => String(roundTo(v, decimals));

function ruleOfThumb(why: string): Et0Result {
  return {
    mm: RULE_OF_THUMB_MM_PER_DAY,
    method: 'rule_of_thumb',
    note:
      `${why}: used the rule of thumb of about 25 mm (1 inch) of water a week, rain included, ` +
      `spread as 25/7 mm a day in place of ET0 (UF/IFAS Gardening Solutions, Purdue Landscape Report, ` +
      `University of Minnesota Extension). It is a rule of thumb, not a computation.`,
    parts: { mmPerWeek: RULE_OF_THUMB_MM_PER_WEEK },
  };
}

/** The humidity the day can give, or why it cannot. */
function humidityOf(day: WeatherDay): { humidity: Humidity; words: string } | null {
  if (percent(day.rhMaxPct) && percent(day.rhMinPct) && day.rhMinPct <= day.rhMaxPct) {
    return { humidity: { rhMaxPct: day.rhMaxPct, rhMinPct: day.rhMinPct }, words: 'RHmax and RHmin (Eq. 17)' };
  }
  if (percent(day.rhMeanPct)) return { humidity: { rhMeanPct: day.rhMeanPct }, words: 'RHmean (Eq. 19)' };
  return null;
}

/**
 * The reference evapotranspiration of one logged day at a site, with the method its log allows:
 * FAO-56 Penman-Monteith (Eq. 6) with a full day; Hargreaves (Eq. 52) from the temperatures when
 * humidity, wind or radiation is missing (none of them is guessed); the rule of thumb of about 25 mm a
 * week when there is no day or no usable pair of temperatures. The note says what was used and assumed.
 * A Penman-Monteith day whose radiation is so low that the equation goes below zero is reported as 0.
 */
export function et0ForDay(day: WeatherDay | null, site: SiteClimate): Et0Result {
  if (!day) return ruleOfThumb('No weather logged for this day');
  const j = dayOfYear(day.date);
  checkLatitude(site.latitude);
  if (!present(day.tMinC) || !present(day.tMaxC)) return ruleOfThumb('No lowest and highest temperature logged for this day');
  const tMin = day.tMinC;
  const tMax = day.tMaxC;
  if (tMin > tMax) return ruleOfThumb(`The lowest temperature logged (${tMin} °C) is above the highest (${tMax} °C)`);

  const sun = extraterrestrialRadiation(site.latitude, j);
  const tMean = meanTemperature(tMin, tMax);
  const daylight = daylightHours(sun.sunsetHourAngleRad);

  const humidity = humidityOf(day);
  const windHeight = present(day.windHeightM) ? day.windHeightM : STANDARD_WIND_HEIGHT_M;
  const windMs = present(day.windMs) && day.windMs >= 0 ? day.windMs : null;
  const windOk = windMs !== null && windHeight > 0.1;
  const measuredRs = present(day.solarMjM2) && day.solarMjM2 >= 0;
  const sunshine = present(day.sunshineH) && day.sunshineH >= 0;

  if (!humidity || !windOk || (!measuredRs && !sunshine)) {
    const missing: string[] = [];
    if (!humidity) missing.push('humidity');
    if (!windOk) missing.push(windMs === null ? 'wind' : 'usable wind height');
    if (!measuredRs && !sunshine) missing.push('solar radiation or sunshine hours');
    const mm = hargreaves(tMin, tMax, sun.ra);
    return {
      mm,
      method: 'hargreaves',
      note:
        `Hargreaves (FAO-56 Eq. 52) from the lowest and highest temperature and the day's extraterrestrial ` +
        `radiation (Eq. 21): no ${missing.join(', no ')} logged, and Penman-Monteith's inputs are not guessed.`,
      parts: { tMeanC: tMean, ra: sun.ra, raMm: MM_PER_MJ * sun.ra },
    };
  }

  const assumed: string[] = [];
  const elevation = present(site.elevationM) ? site.elevationM : 0;
  if (!present(site.elevationM)) assumed.push('the site has no elevation, so sea level (0 m) is assumed');
  const pressure = atmosphericPressure(elevation);
  const gamma = psychrometricConstant(pressure);
  const es = meanSaturationVapourPressure(tMin, tMax);
  const ea = actualVapourPressure(tMin, tMax, humidity.humidity);
  const delta = slopeOfVapourPressureCurve(tMean);
  const u2 = windAt2m(windMs, windHeight);
  const windWords =
    windHeight === STANDARD_WIND_HEIGHT_M
      ? present(day.windHeightM)
        ? 'wind at 2 m'
        : 'wind (taken as measured at 2 m, no height logged)'
      : `wind at ${round(windHeight, 2)} m converted to 2 m (Eq. 47)`;

  let rs: number;
  let radiationWords: string;
  if (measuredRs) {
    rs = day.solarMjM2 as number;
    radiationWords = 'measured solar radiation';
  } else {
    let n = day.sunshineH as number;
    if (n > daylight) {
      assumed.push(`${round(n, 2)} sunshine hours is more than the ${round(daylight, 1)} h of daylight (Eq. 34), so ${round(daylight, 1)} h was used`);
      n = daylight;
    }
    rs = solarRadiationFromSunshine(n, daylight, sun.ra);
    radiationWords = 'sunshine hours (Eq. 35)';
  }
  const rso = clearSkyRadiation(elevation, sun.ra);
  const rnl = netLongwave(tMin, tMax, ea, rs, rso);
  const rn = netRadiation(rs, rnl);
  const g = 0; // a day's soil heat flux is small beneath the grass reference: FAO-56 Eq. 42
  const raw = penmanMonteith({ delta, gamma, rn, g, tMeanC: tMean, u2, es, ea });
  if (raw < 0) assumed.push(`the equation gave ${round(raw, 2)} mm, reported as 0`);

  return {
    mm: Math.max(0, raw),
    method: 'penman_monteith',
    note:
      `FAO-56 Penman-Monteith (Eq. 6) from the lowest and highest temperature, ${humidity.words}, ${windWords} ` +
      `and ${radiationWords}; soil heat flux taken as 0 for a day (Eq. 42)` +
      (assumed.length ? `; ${assumed.join('; ')}.` : '.'),
    parts: { tMeanC: tMean, pressure, gamma, delta, es, ea, u2, ra: sun.ra, daylightH: daylight, rs, rso, rns: netShortwave(rs), rnl, rn, g, et0Raw: raw },
  };
}
