import { describe, expect, it } from 'vitest';
import {
  RULE_OF_THUMB_MM_PER_DAY,
  actualVapourPressure,
  atmosphericPressure,
  clearSkyRadiation,
  dayOfYear,
  daylightHours,
  et0ForDay,
  extraterrestrialRadiation,
  hargreaves,
  meanSaturationVapourPressure,
  netLongwave,
  netRadiation,
  penmanMonteith,
  psychrometricConstant,
  saturationVapourPressure,
  slopeOfVapourPressureCurve,
  soilHeatFluxMonthly,
  solarRadiationFromSunshine,
  windAt2m,
  type WeatherDay,
} from './et0';

// Check values are FAO Irrigation and Drainage Paper 56 (Allen, Pereira, Raes, Smith, 1998), its
// worked examples, named beside each check. FAO rounds every intermediate value as it prints it, and
// we do not, so each check allows the printed precision: `near(actual, printed, tol)` with tol half a
// unit of the last printed digit (0.005 for two decimals, 0.05 for one), widened only where the
// comment says why.
function near(actual: number, printed: number, tol: number): void {
  expect(Math.abs(actual - printed), `${actual} should be within ${tol} of ${printed}`).toBeLessThanOrEqual(tol);
}

// FAO-56 Example 18: Uccle (Brussels), 6 July, 50°48′N, 100 m; Tmax 21.5 °C, Tmin 12.3 °C, RHmax 84 %,
// RHmin 63 %, wind 10 km/h at 10 m, 9.25 h of bright sunshine.
const brussels: WeatherDay = {
  date: '2026-07-06',
  tMinC: 12.3,
  tMaxC: 21.5,
  rainMm: 0,
  rhMaxPct: 84,
  rhMinPct: 63,
  windMs: 10 / 3.6, // 10 km/h (computed: 10000 m / 3600 s)
  windHeightM: 10,
  sunshineH: 9.25,
};
const uccle = { latitude: 50 + 48 / 60, elevationM: 100 }; // 50°48′ = 50.8° (computed)

// FAO-56 Example 17: Bangkok, April (J = 105), 13°44′N, 2 m; Tmax 34.8 °C, Tmin 25.6 °C, ea 2.85 kPa,
// u2 2 m/s, n 8.5 h, March mean 29.2 °C.
const bangkok = { latitude: 13 + 44 / 60, elevationM: 2, j: 105, tMax: 34.8, tMin: 25.6, ea: 2.85, u2: 2, n: 8.5, marchMeanC: 29.2 };

describe('supporting equations (FAO-56 Chapter 3)', () => {
  it('gives P 81.8 kPa and γ 0.054 kPa/°C at 1800 m (FAO-56 Example 2, Eq. 7 and 8)', () => {
    const p = atmosphericPressure(1800);
    near(p, 81.8, 0.05); // printed with one decimal
    near(psychrometricConstant(p), 0.054, 0.0005); // printed with three decimals
  });

  it('gives 101.3 kPa at sea level (FAO-56 Eq. 7: the equation\'s own constant at z = 0)', () => {
    expect(atmosphericPressure(0)).toBeCloseTo(101.3, 12);
  });

  it('gives es 2.39 kPa for Tmin 15 °C, Tmax 24.5 °C (FAO-56 Example 3, Eq. 11 and 12)', () => {
    near(meanSaturationVapourPressure(15, 24.5), 2.39, 0.005);
    // FAO-56 Example 3's intermediate e°(24.5) = 3.075 and e°(15) = 1.705 kPa (three decimals; from memory,
    // not in the check-value table we hold).
    near(saturationVapourPressure(24.5), 3.075, 0.0005);
    near(saturationVapourPressure(15), 1.705, 0.0005);
  });

  // The next two are Example 18's intermediate values, from memory (not in the check-value table we hold).
  it('gives Δ 0.122 kPa/°C at the Brussels mean 16.9 °C (FAO-56 Example 18, Eq. 13)', () => {
    near(slopeOfVapourPressureCurve(16.9), 0.122, 0.0005);
  });

  it('gives ea 1.409 kPa from RHmax 84 %, RHmin 63 % at Brussels (FAO-56 Example 18, Eq. 17)', () => {
    near(actualVapourPressure(12.3, 21.5, { rhMaxPct: 84, rhMinPct: 63 }), 1.409, 0.0005);
  });

  it('takes RHmean as a share of es (FAO-56 Eq. 19)', () => {
    // computed: ea = 0.7 × es by Eq. 19's definition
    const es = meanSaturationVapourPressure(12.3, 21.5);
    expect(actualVapourPressure(12.3, 21.5, { rhMeanPct: 70 })).toBeCloseTo(0.7 * es, 12);
  });

  it('gives u2 2.4 m/s from 3.2 m/s at 10 m (FAO-56 Example 14, Eq. 47)', () => {
    near(windAt2m(3.2, 10), 2.4, 0.05);
  });

  it('leaves wind measured at 2 m unchanged (FAO-56 Eq. 47 is the conversion to 2 m)', () => {
    // computed: Eq. 47 at z = 2 is 4.87 / ln(130.18) = 1.0002 only because its constants are rounded
    expect(windAt2m(3, 2)).toBe(3);
    near(windAt2m(3, 2.0001), 3, 0.001);
    expect(() => windAt2m(3, 0.05)).toThrow(RangeError);
  });

  it('counts days of the year from 1 January (FAO-56 Example 18: 6 July is J 187; Example 8: 3 September is J 246)', () => {
    expect(dayOfYear('2026-07-06')).toBe(187);
    expect(dayOfYear('2026-09-03')).toBe(246);
    expect(dayOfYear('2026-01-01')).toBe(1);
    expect(dayOfYear('2028-12-31')).toBe(366); // computed: 2028 is a leap year
    expect(() => dayOfYear('2026-02-30')).toThrow(RangeError);
  });
});

describe('radiation (FAO-56 Chapter 3)', () => {
  it('gives Ra 32.2 MJ/m²/day at 20°S on 3 September (FAO-56 Example 8, Eq. 21-25)', () => {
    const sun = extraterrestrialRadiation(-20, 246);
    near(sun.dr, 0.985, 0.0005);
    near(sun.declinationRad, 0.12, 0.0005); // printed 0.120 rad
    near(sun.sunsetHourAngleRad, 1.527, 0.0005);
    near(sun.ra, 32.2, 0.05);
    near(0.408 * sun.ra, 13.1, 0.05); // FAO-56 Example 8: 13.1 mm/day (Eq. 20, 0.408 × Ra)
  });

  it('gives N 11.7 h on the same day (FAO-56 Example 9, Eq. 34)', () => {
    near(daylightHours(extraterrestrialRadiation(-20, 246).sunsetHourAngleRad), 11.7, 0.05);
  });

  it('gives 12 h of daylight at the equator on any day (computed: ωs = arccos(0) = π/2, N = 24/π × π/2)', () => {
    expect(daylightHours(extraterrestrialRadiation(0, 100).sunsetHourAngleRad)).toBeCloseTo(12, 12);
  });

  it('gives 24 h of sun at midsummer and none at midwinter beyond the polar circle (FAO-56 Eq. 25 held at its bounds)', () => {
    const summer = extraterrestrialRadiation(78, dayOfYear('2026-06-21'));
    const winter = extraterrestrialRadiation(78, dayOfYear('2026-12-21'));
    expect(daylightHours(summer.sunsetHourAngleRad)).toBeCloseTo(24, 12); // computed: ωs = π
    expect(winter.ra).toBe(0); // computed: ωs = 0, no sun
    expect(Number.isFinite(summer.ra) && summer.ra > 0).toBe(true);
    expect(() => extraterrestrialRadiation(91, 100)).toThrow(RangeError);
  });

  it('works through Brussels: Ra 41.09, Rs 22.07, Rso 30.90, Rnl 3.71, Rn 13.28 MJ/m²/day (FAO-56 Example 18)', () => {
    const sun = extraterrestrialRadiation(uccle.latitude, dayOfYear(brussels.date));
    near(sun.ra, 41.09, 0.005);
    const n = daylightHours(sun.sunsetHourAngleRad);
    near(n, 16.1, 0.05); // FAO-56 Example 18's N = 16.1 h (from memory)
    const rs = solarRadiationFromSunshine(9.25, n, sun.ra);
    near(rs, 22.07, 0.005);
    const rso = clearSkyRadiation(100, sun.ra);
    near(rso, 30.9, 0.005);
    const ea = actualVapourPressure(12.3, 21.5, { rhMaxPct: 84, rhMinPct: 63 });
    const rnl = netLongwave(12.3, 21.5, ea, rs, rso);
    near(rnl, 3.71, 0.005);
    near(netRadiation(rs, rnl), 13.28, 0.005);
  });

  it('limits Rs/Rso to 1 in Rnl (FAO-56 Eq. 39)', () => {
    // computed: a measured Rs above Rso gives the same Rnl as Rs = Rso
    expect(netLongwave(12, 22, 1.4, 35, 30)).toBeCloseTo(netLongwave(12, 22, 1.4, 30, 30), 12);
  });
});

describe('penmanMonteith (FAO-56 Eq. 6)', () => {
  function bangkokParts() {
    const sun = extraterrestrialRadiation(bangkok.latitude, bangkok.j);
    const n = daylightHours(sun.sunsetHourAngleRad);
    const rs = solarRadiationFromSunshine(bangkok.n, n, sun.ra);
    const rso = clearSkyRadiation(bangkok.elevationM, sun.ra);
    const rn = netRadiation(rs, netLongwave(bangkok.tMin, bangkok.tMax, bangkok.ea, rs, rso));
    const tMean = (bangkok.tMax + bangkok.tMin) / 2; // FAO-56 Example 17: 30.2 °C
    return {
      ra: sun.ra,
      n,
      parts: {
        delta: slopeOfVapourPressureCurve(tMean),
        gamma: psychrometricConstant(atmosphericPressure(bangkok.elevationM)),
        rn,
        g: soilHeatFluxMonthly({ previousC: bangkok.marchMeanC, thisC: tMean }),
        tMeanC: tMean,
        u2: bangkok.u2,
        es: meanSaturationVapourPressure(bangkok.tMin, bangkok.tMax),
        ea: bangkok.ea,
      },
    };
  }

  it('gives Bangkok in April Ra 38.06, Rn 14.33 MJ/m²/day, G 0.14 and ET0 5.72 mm/day (FAO-56 Example 17)', () => {
    const { ra, n, parts } = bangkokParts();
    near(ra, 38.06, 0.005);
    near(n, 12.31, 0.005); // FAO-56 Example 17's N = 12.31 h (from memory)
    near(parts.rn, 14.33, 0.005);
    near(parts.g, 0.14, 0.005); // FAO-56 Eq. 44: 0.14 × (30.2 − 29.2)
    near(penmanMonteith(parts), 5.72, 0.005);
  });

  it('gives 5.76 mm/day for Bangkok when G is left out, so 5.72 above proves G is applied (FAO-56 Example 17)', () => {
    const { parts } = bangkokParts();
    const withoutG = penmanMonteith({ ...parts, g: 0 });
    near(withoutG, 5.76, 0.005);
    expect(Math.abs(withoutG - penmanMonteith(parts))).toBeGreaterThan(0.03); // the two printed values are 0.04 apart
  });

  it('takes G from the months on either side when the next month is known (FAO-56 Eq. 43)', () => {
    // computed: 0.07 × (31 − 29.2) = 0.126
    expect(soilHeatFluxMonthly({ previousC: 29.2, thisC: 30.2, nextC: 31 })).toBeCloseTo(0.126, 12);
  });
});

describe('hargreaves (FAO-56 Eq. 52)', () => {
  it('gives 4.06 mm/day for the Brussels day (computed: 0.0023 × (16.9 + 17.8) × √9.2 × 0.408 × 41.09)', () => {
    const ra = extraterrestrialRadiation(uccle.latitude, 187).ra;
    near(hargreaves(12.3, 21.5, ra), 4.06, 0.005);
  });

  it('gives 5.20 mm/day for the Bangkok April data (computed: 0.0023 × (30.2 + 17.8) × √9.2 × 0.408 × 38.06)', () => {
    const ra = extraterrestrialRadiation(bangkok.latitude, bangkok.j).ra;
    near(hargreaves(bangkok.tMin, bangkok.tMax, ra), 5.2, 0.005);
  });

  it('refuses Tmax below Tmin', () => {
    expect(() => hargreaves(20, 10, 30)).toThrow(RangeError);
  });
});

describe('et0ForDay: the method a day\'s log allows', () => {
  it('uses Penman-Monteith on a full Brussels day: u2 2.078 m/s, Rn 13.28, ET0 3.88 mm/day (FAO-56 Example 18)', () => {
    const r = et0ForDay(brussels, uccle);
    expect(r.method).toBe('penman_monteith');
    near(r.parts!.u2, 2.078, 0.0005); // printed with three decimals
    near(r.parts!.ra, 41.09, 0.005);
    near(r.parts!.rs, 22.07, 0.005);
    near(r.parts!.rso, 30.9, 0.005);
    near(r.parts!.rnl, 3.71, 0.005);
    near(r.parts!.rn, 13.28, 0.005);
    expect(r.parts!.g).toBe(0); // FAO-56 Eq. 42: G = 0 for a day
    near(r.mm, 3.88, 0.005); // FAO-56 Example 18: 3.88 unrounded
    near(r.mm, 3.9, 0.05); // and 3.9 mm/day as printed
    expect(r.note).toMatch(/Penman-Monteith/);
    expect(r.note).toMatch(/Eq\. 47/);
    expect(r.note).toMatch(/Eq\. 42/);
    expect(r.note).not.toMatch(/sea level/);
  });

  it('uses RHmean alone with Eq. 19 when RHmax and RHmin are not logged', () => {
    // computed: the Brussels day with RHmean 73.5 % (the mean of 84 and 63) still goes through Penman-Monteith
    const r = et0ForDay({ ...brussels, rhMaxPct: null, rhMinPct: null, rhMeanPct: 73.5 }, uccle);
    expect(r.method).toBe('penman_monteith');
    expect(r.note).toMatch(/Eq\. 19/);
    const es = meanSaturationVapourPressure(12.3, 21.5);
    expect(r.parts!.ea).toBeCloseTo(0.735 * es, 12);
  });

  it('prefers measured solar radiation over sunshine hours', () => {
    // FAO-56 Example 18's Rs is 22.07 from sunshine; a measured 22.07 gives the same ET0 (computed)
    const measured = et0ForDay({ ...brussels, sunshineH: null, solarMjM2: 22.07 }, uccle);
    expect(measured.method).toBe('penman_monteith');
    expect(measured.parts!.rs).toBe(22.07);
    near(measured.mm, 3.88, 0.005);
    expect(measured.note).toMatch(/measured solar radiation/);
    const both = et0ForDay({ ...brussels, solarMjM2: 15 }, uccle);
    expect(both.parts!.rs).toBe(15);
  });

  it('assumes sea level when the site has no elevation, and says so', () => {
    const r = et0ForDay(brussels, { latitude: uccle.latitude, elevationM: null });
    expect(r.method).toBe('penman_monteith');
    expect(r.parts!.pressure).toBeCloseTo(101.3, 12); // FAO-56 Eq. 7 at z = 0
    expect(r.note).toMatch(/sea level/);
    // computed: 100 m changes P by about 1.2 kPa, so ET0 moves a little but stays near 3.88
    near(r.mm, 3.88, 0.02);
    expect(r.mm).not.toBe(et0ForDay(brussels, uccle).mm);
  });

  it('takes wind with no height as measured at 2 m', () => {
    const r = et0ForDay({ ...brussels, windMs: 2.078, windHeightM: null }, uccle);
    expect(r.parts!.u2).toBe(2.078);
    near(r.mm, 3.88, 0.005); // FAO-56 Example 18: the same day with u2 already at 2 m
    expect(r.note).toMatch(/2 m/);
  });

  it('uses Hargreaves from temperatures alone: 4.06 mm/day for the Brussels temperatures (computed, FAO-56 Eq. 52)', () => {
    const r = et0ForDay({ date: brussels.date, tMinC: 12.3, tMaxC: 21.5, rainMm: null }, uccle);
    expect(r.method).toBe('hargreaves');
    near(r.mm, 4.06, 0.005);
    expect(r.note).toMatch(/Hargreaves/);
  });

  it('does not guess the wind: no wind → Hargreaves', () => {
    const r = et0ForDay({ ...brussels, windMs: null }, uccle);
    expect(r.method).toBe('hargreaves');
    expect(r.note).toMatch(/no wind/);
  });

  it('does not guess the humidity: no humidity (or only one of RHmax and RHmin) → Hargreaves', () => {
    expect(et0ForDay({ ...brussels, rhMaxPct: null, rhMinPct: null }, uccle).method).toBe('hargreaves');
    const one = et0ForDay({ ...brussels, rhMinPct: null }, uccle);
    expect(one.method).toBe('hargreaves');
    expect(one.note).toMatch(/no humidity/);
  });

  it('does not guess the radiation: no sunshine and no measured Rs → Hargreaves', () => {
    const r = et0ForDay({ ...brussels, sunshineH: null, solarMjM2: null }, uccle);
    expect(r.method).toBe('hargreaves');
    expect(r.note).toMatch(/no solar radiation or sunshine hours/);
  });

  it('falls back to the rule of thumb, 25/7 mm/day, with no day or no temperatures (UF/IFAS, Purdue, University of Minnesota Extension)', () => {
    // computed: 25 mm a week / 7 days = 3.5714… mm/day
    const none = et0ForDay(null, uccle);
    expect(none.method).toBe('rule_of_thumb');
    expect(none.mm).toBeCloseTo(25 / 7, 12);
    expect(none.note).toMatch(/rule of thumb, not a computation/);
    const noTemps = et0ForDay({ ...brussels, tMinC: null }, uccle);
    expect(noTemps.method).toBe('rule_of_thumb');
    expect(noTemps.mm).toBe(RULE_OF_THUMB_MM_PER_DAY);
    expect(et0ForDay({ date: '2026-07-06', tMinC: null, tMaxC: null, rainMm: 4 }, uccle).method).toBe('rule_of_thumb');
  });

  it('does not compute from a day whose lowest temperature is above its highest', () => {
    const r = et0ForDay({ ...brussels, tMinC: 25, tMaxC: 20 }, uccle);
    expect(r.method).toBe('rule_of_thumb');
    expect(r.note).toMatch(/above the highest/);
  });

  it('caps sunshine hours at the day\'s daylight hours and says so', () => {
    // computed: Brussels on 6 July has N = 16.1 h; 20 h logged is read as 16.1 h (n/N = 1)
    const r = et0ForDay({ ...brussels, sunshineH: 20 }, uccle);
    expect(r.parts!.rs).toBeCloseTo(0.75 * r.parts!.ra, 12); // FAO-56 Eq. 35 with n = N: (0.25 + 0.50) Ra
    expect(r.note).toMatch(/more than the 16\.1 h of daylight/);
  });

  it('never reports a negative ET0', () => {
    // computed: a cold, dark, saturated, still day drives Eq. 6 below zero (Rn < 0, es = ea)
    const r = et0ForDay({ date: '2026-12-21', tMinC: 0, tMaxC: 0.5, rainMm: 0, rhMaxPct: 100, rhMinPct: 100, windMs: 0, windHeightM: 2, sunshineH: 0 }, { latitude: 65, elevationM: 0 });
    expect(r.method).toBe('penman_monteith');
    expect(r.parts!.et0Raw).toBeLessThan(0);
    expect(r.mm).toBe(0);
    expect(r.note).toMatch(/reported as 0/);
  });
});
