import type { Knex } from 'knex';
import { addCalendarDays } from '@shared/dates';
import { roundTo } from '@shared/geometry';
import { fahrenheitToCelsius, inchesToMm } from '@shared/weather';

// Daily weather for both demo sites from 1 April 2026 (the start of the 2026 growing season) to
// 20 November 2026, the demo's fixed "now" (seeds/03-demo-spring-round.ts). EVERY FIGURE HERE IS
// INVENTED FOR THE DEMO by a seeded pseudo-random generator, so the demo is the same on every run;
// the shapes are loosely like the two kinds of place (from memory), not any real station's record.
// - Mossgate Lane (metric, 53.4° N, north-west England-like): mild, damp and cloudy; temperatures,
//   rain, relative humidity (lowest and highest), wind at 2 m and hours of sunshine on most days, so a
//   full FAO-56 Penman-Monteith day can be worked out; now and then a day with only the rain gauge.
// - Orchard Corner (US units, 40° N high plains): sunnier and drier with a wide daily range; only
//   temperatures and rain (so only Hargreaves applies), typed in °F and inches, with a few days missing.

const FIRST_DAY = '2026-04-01';
const LAST_DAY = '2026-11-20';

/** mulberry32: a small seeded generator, so the invented weather is the same every run. */
function generator(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A normally distributed number (Box–Muller) from the generator. */
function normal(rand: () => number): number {
  const u = Math.max(rand(), 1e-12);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

function dayOfYear(day: string): number {
  const [y, m, d] = day.split('-').map(Number);
  return (Date.UTC(y, m - 1, d) - Date.UTC(y, 0, 0)) / 86_400_000;
}

/** The seasonal swing of a site's mean temperature: lowest in mid-January, highest in mid-July. */
const seasonal = (day: string, mean: number, amplitude: number) => mean + amplitude * Math.sin((2 * Math.PI * (dayOfYear(day) - 109)) / 365);

/** Hours from sunrise to sunset at a latitude on a day (FAO-56 eq. 24, 25 and 34: declination, sunset hour angle, daylight hours). */
function dayLength(day: string, latitudeDeg: number): number {
  const j = dayOfYear(day);
  const declination = 0.409 * Math.sin((2 * Math.PI * j) / 365 - 1.39);
  const ws = Math.acos(clamp(-Math.tan((latitudeDeg * Math.PI) / 180) * Math.tan(declination), -1, 1));
  return (24 / Math.PI) * ws;
}

function allDays(): string[] {
  const days: string[] = [];
  for (let d = FIRST_DAY; d <= LAST_DAY; d = addCalendarDays(d, 1)) days.push(d);
  return days;
}

interface Row {
  day: string;
  t_min_c: number | null;
  t_max_c: number | null;
  rain_mm: number | null;
  rh_min_pct: number | null;
  rh_max_pct: number | null;
  wind_ms: number | null;
  wind_height_m: number | null;
  sunshine_h: number | null;
  source: 'gauge' | 'import';
  by: 'maren' | 'teodor';
}

function mossgateDays(): Row[] {
  const rand = generator(20260401);
  let spell = 0; // days of weather persist: a warm or cool, wet or dry spell
  let wet = 0.5;
  return allDays().map((day) => {
    spell = 0.7 * spell + normal(rand) * 1.4;
    wet = clamp(0.75 * wet + 0.25 * (rand() < 0.55 ? 1 : 0), 0, 1);
    const raining = rand() < 0.25 + 0.5 * wet;
    const rain = raining ? roundTo(Math.min(45, -Math.log(Math.max(rand(), 1e-9)) * 4.2), 1) : 0;
    const mean = seasonal(day, 10, 6) + spell;
    const halfRange = clamp(4 + normal(rand) * 1.2 - (raining ? 1.2 : 0), 1.5, 7.5);
    const daylight = dayLength(day, 53.4);
    const sunshine = clamp(daylight * (raining ? 0.12 + rand() * 0.3 : 0.3 + rand() * 0.55), 0, daylight);
    // About one day in eleven only the rain gauge was read (teodor's entries from the plot).
    if (rand() < 0.09) {
      return { day, t_min_c: null, t_max_c: null, rain_mm: rain, rh_min_pct: null, rh_max_pct: null, wind_ms: null, wind_height_m: null, sunshine_h: null, source: 'gauge', by: 'teodor' };
    }
    const rhMax = clamp(Math.round(90 + rand() * 9), 0, 100);
    const rhMin = clamp(Math.round((raining ? 68 : 50) + normal(rand) * 8), 25, rhMax - 5);
    return {
      day,
      t_min_c: roundTo(mean - halfRange, 1),
      t_max_c: roundTo(mean + halfRange, 1),
      rain_mm: rain,
      rh_min_pct: rhMin,
      rh_max_pct: rhMax,
      wind_ms: roundTo(clamp(3 + normal(rand) * 1.1 + (raining ? 0.8 : 0), 0.4, 11), 1),
      wind_height_m: 2,
      sunshine_h: roundTo(sunshine, 1),
      source: 'import',
      by: 'maren',
    };
  });
}

function orchardDays(): Row[] {
  const rand = generator(20260402);
  let spell = 0;
  const rows: Row[] = [];
  for (const day of allDays()) {
    spell = 0.65 * spell + normal(rand) * 2.4;
    // A few days were never written down.
    if (rand() < 0.04) continue;
    // Afternoon storms in high summer, drier spring and autumn.
    const summer = Math.max(0, Math.sin((2 * Math.PI * (dayOfYear(day) - 120)) / 365));
    const raining = rand() < 0.12 + 0.16 * summer;
    const inches = raining ? roundTo(Math.min(2.5, 0.02 + -Math.log(Math.max(rand(), 1e-9)) * 0.22), 2) : 0;
    const meanF = seasonal(day, 52, 22) + spell;
    const halfRangeF = clamp(15 + normal(rand) * 3 - (raining ? 4 : 0), 5, 24);
    rows.push({
      day,
      // Read in whole °F and hundredths of an inch, stored in SI as the API keeps it.
      t_min_c: roundTo(fahrenheitToCelsius(Math.round(meanF - halfRangeF)), 2),
      t_max_c: roundTo(fahrenheitToCelsius(Math.round(meanF + halfRangeF)), 2),
      rain_mm: roundTo(inchesToMm(inches), 3),
      rh_min_pct: null,
      rh_max_pct: null,
      wind_ms: null,
      wind_height_m: null,
      sunshine_h: null,
      source: 'import',
      by: 'maren',
    });
  }
  return rows;
}

export async function seed(knex: Knex): Promise<void> {
  await knex('weather_days').delete();
  const club = await knex('clubs').where({ slug: 'mossgate' }).first('id');
  const sites = await knex('sites').where({ club_id: club.id }).select('id', 'name');
  const siteId = (name: string) => sites.find((s: { name: string }) => s.name === name).id as number;
  const people = await knex('users').whereIn('email', ['maren@example.org', 'teodor@example.org']).select('id', 'email');
  const userId = (who: Row['by']) => people.find((p: { email: string }) => p.email === `${who}@example.org`).id as number;
  for (const [name, rows] of [
    ['Mossgate Lane', mossgateDays()],
    ['Orchard Corner', orchardDays()],
  ] as const) {
    const records = rows.map(({ by, ...r }) => ({
      site_id: siteId(name),
      ...r,
      entered_by_user_id: userId(by),
      created_at: new Date(`${r.day}T19:00:00Z`),
      updated_at: new Date(`${r.day}T19:00:00Z`),
    }));
    for (let i = 0; i < records.length; i += 200) await knex('weather_days').insert(records.slice(i, i + 200));
  }
}
