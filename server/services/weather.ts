import type { Knex } from 'knex';
import { addCalendarDays, formatDate, localToday } from '@shared/dates';
import { roundTo, type UnitSystem } from '@shared/geometry';
import { daysBetween } from '@shared/plot-book/dates';
import {
  DEFAULT_WEATHER_DAYS,
  EARLIEST_WEATHER_DAY,
  MAX_WEATHER_DAYS_PER_REQUEST,
  type WeatherDay,
  type WeatherDayBody,
  type WeatherLog,
  type WeatherSites,
  type WeatherSource,
} from '@shared/schemas/weather';
import { crossFieldProblems, isEmptyDay, weatherQuantities, weatherQuantity, weatherValueKeys, type WeatherValueKey, type WeatherValues } from '@shared/weather';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { pickCurrentSeason } from './plot-book';
import { replanAfterWeather } from './tasks';

// The daily weather log of a site (see DEVELOPERS.md, 2026-12-03). Who may do what is decided here,
// in `weatherAccess`, for every route: every member of the club reads the log; the club's coordinators
// and anyone holding a plot at that site in the club's current season write it; coordinators delete
// days and alone see who entered them; outside the club (or an archived site) it is 404, like every
// site route. Values are SI everywhere in here; US units exist only in the client and in CSV files.
//
// Every write answers the calendar days it changed (`changedDays`), so work that depends on the log
// (watering tasks, say) can be redone for exactly those days inside the same transaction.

/** First key of the per-site advisory lock that orders writes to a site's log. */
const WEATHER_LOCK = 71_841;

export interface WeatherSiteInfo {
  id: number;
  clubId: number;
  name: string;
  units: UnitSystem;
  timeZone: string;
  latitude: number;
  elevationM: number | null;
}

export interface WeatherAccess {
  site: WeatherSiteInfo;
  /** Today in the site's time zone: the latest day the log takes. */
  today: string;
  isCoordinator: boolean;
  canWrite: boolean;
}

/** A stored day in SI, as other services read it (the water computation, say). */
export interface StoredWeatherDay extends WeatherValues {
  day: string;
  source: WeatherSource;
}

interface WeatherRow {
  day: string;
  t_min_c: number | null;
  t_max_c: number | null;
  rain_mm: number | null;
  rh_min_pct: number | null;
  rh_max_pct: number | null;
  rh_mean_pct: number | null;
  wind_ms: number | null;
  wind_height_m: number | null;
  sunshine_h: number | null;
  solar_mj_m2: number | null;
  source: WeatherSource;
  updated_at: Date;
  entered_by_name?: string | null;
}

const valueColumns = weatherQuantities.map((q) => q.column);

function valuesOf(r: WeatherRow): WeatherValues {
  const out = {} as WeatherValues;
  for (const q of weatherQuantities) out[q.key] = r[q.column as keyof WeatherRow] as number | null;
  return out;
}

function toDay(r: WeatherRow, withName: boolean): WeatherDay {
  const day: WeatherDay = { day: r.day, ...valuesOf(r), source: r.source, updatedAt: r.updated_at.toISOString() };
  if (withName) day.enteredByName = r.entered_by_name ?? null;
  return day;
}

function columnsOf(v: Partial<WeatherValues>): Record<string, number | null> {
  const out: Record<string, number | null> = {};
  for (const q of weatherQuantities) {
    const value = v[q.key];
    if (value !== undefined) out[q.column] = value === null ? null : roundTo(value, q.decimals);
  }
  return out;
}

/** Rounds SI values to the precision their columns keep, so what is checked is what is stored. */
function rounded(v: Partial<WeatherValues>): Partial<WeatherValues> {
  const out: Partial<WeatherValues> = {};
  for (const k of weatherValueKeys) {
    const value = v[k];
    if (value !== undefined) out[k] = value === null ? null : roundTo(value, weatherQuantity[k].decimals);
  }
  return out;
}

/**
 * Decides what a person may do with a site's weather log, with one query for the site, their roles,
 * the club's seasons and the seasons they hold a live plot on this site. 404 when the site is missing,
 * archived or in a club they are not part of.
 */
export async function weatherAccess(db: Db, opts: { siteId: number; userId: number; now?: Date }): Promise<WeatherAccess> {
  const row = await db('sites as s')
    .join('clubs as c', 'c.id', 's.club_id')
    .where('s.id', opts.siteId)
    .whereNull('s.archived_at')
    .first(
      's.id', 's.club_id', 's.name', 's.units', 's.time_zone', 's.latitude', 's.elevation_m', 'c.time_zone as club_time_zone',
      db.raw("(select coalesce(array_agg(m.role::text), '{}') from memberships m where m.club_id = s.club_id and m.user_id = ?) as roles", [opts.userId]),
      db.raw("(select coalesce(json_agg(json_build_object('id', se.id, 'year', se.year)), '[]') from seasons se where se.club_id = s.club_id) as seasons"),
      db.raw(
        `(select coalesce(array_agg(distinct a.season_id), '{}') from allocations a join plots p on p.id = a.plot_id
          where p.site_id = s.id and p.deleted_at is null and a.user_id = ? and a.status = 'active') as held`,
        [opts.userId],
      ),
    );
  const roles: string[] = row?.roles ?? [];
  if (!row || roles.length === 0) throw notFound('The site');
  const season = pickCurrentSeason(row.seasons as Array<{ id: number; year: number }>, row.club_time_zone ?? 'UTC', opts.now);
  const isCoordinator = roles.includes('coordinator');
  const holdsHere = season !== null && (row.held as number[]).includes(season.id);
  return {
    site: {
      id: row.id,
      clubId: row.club_id,
      name: row.name,
      units: row.units,
      timeZone: row.time_zone,
      latitude: Number(row.latitude),
      elevationM: row.elevation_m ?? null,
    },
    today: localToday(row.time_zone, opts.now),
    isCoordinator,
    canWrite: isCoordinator || holdsHere,
  };
}

function refuseWrite(access: WeatherAccess): void {
  if (!access.canWrite) {
    throw new AppError('forbidden', `Only the coordinators and this season’s plot holders at ${access.site.name} can log its weather.`);
  }
}

/** Refuses a day after the site's today, naming the field. */
function assertNotAfterToday(day: string, access: WeatherAccess, field = 'day'): void {
  if (day > access.today) {
    const message = `Not after today at ${access.site.name} (${formatDate(access.today, access.site.timeZone)})`;
    throw new AppError('validation_failed', 'That day has not happened yet at the site.', { [field]: message });
  }
}

/** The live sites of a club with whether the person may log weather there, by name (the rain gauge's choice of site). */
export async function listWeatherSites(db: Db, opts: { clubId: number; userId: number; now?: Date }): Promise<WeatherSites> {
  const sites: Array<{ id: number }> = await db('sites').where({ club_id: opts.clubId }).whereNull('archived_at').orderBy('name').select('id');
  const items = [];
  for (const s of sites) {
    const access = await weatherAccess(db, { siteId: s.id, userId: opts.userId, now: opts.now });
    items.push({ id: s.id, name: access.site.name, units: access.site.units, timeZone: access.site.timeZone, today: access.today, canWrite: access.canWrite });
  }
  return { items };
}

function daysQuery(db: Db, siteId: number, withName: boolean) {
  const q = db('weather_days as w').where('w.site_id', siteId);
  if (withName) q.leftJoin('users as u', 'u.id', 'w.entered_by_user_id').select('w.*', 'u.name as entered_by_name');
  else q.select('w.*');
  return q;
}

/** The range a read asks for: `to` defaults to the site's today, `from` to eight weeks before `to`; at most 400 days. */
function rangeOf(access: WeatherAccess, from?: string, to?: string): { from: string; to: string } {
  const end = to ?? (from && from > access.today ? from : access.today);
  const start = from ?? addCalendarDays(end, -(DEFAULT_WEATHER_DAYS - 1));
  const clampedStart = start < EARLIEST_WEATHER_DAY ? EARLIEST_WEATHER_DAY : start;
  if (clampedStart > end) throw new AppError('validation_failed', 'The range ends before it starts.', { from: `On or before ${end}` });
  if (daysBetween(clampedStart, end) + 1 > MAX_WEATHER_DAYS_PER_REQUEST) {
    throw new AppError('validation_failed', 'That range is too long.', { from: `At most ${MAX_WEATHER_DAYS_PER_REQUEST} days at a time` });
  }
  return { from: clampedStart, to: end };
}

/** A site's log for a range of days, newest first, with the units and zone to show it in. */
export async function getWeatherLog(db: Db, opts: { siteId: number; userId: number; from?: string; to?: string; now?: Date }): Promise<WeatherLog> {
  const access = await weatherAccess(db, opts);
  const range = rangeOf(access, opts.from, opts.to);
  const rows: WeatherRow[] = await daysQuery(db, access.site.id, access.isCoordinator)
    .whereBetween('w.day', [range.from, range.to])
    .orderBy('w.day', 'desc');
  return {
    siteId: access.site.id,
    siteName: access.site.name,
    units: access.site.units,
    timeZone: access.site.timeZone,
    today: access.today,
    from: range.from,
    to: range.to,
    canWrite: access.canWrite,
    canDelete: access.isCoordinator,
    days: rows.map((r) => toDay(r, access.isCoordinator)),
  };
}

/**
 * A site's stored days from `from` to `to` (both included), oldest first, in SI: for services that
 * compute from the weather. No access check: callers have made theirs.
 */
export async function loadWeatherDays(db: Db, siteId: number, from: string, to: string): Promise<StoredWeatherDay[]> {
  const rows: WeatherRow[] = await db('weather_days').where({ site_id: siteId }).whereBetween('day', [from, to]).orderBy('day').select('day', 'source', ...valueColumns);
  return rows.map((r) => ({ day: r.day, source: r.source, ...valuesOf(r) }));
}

const lockLog = (trx: Knex.Transaction, siteId: number) => trx.raw('select pg_advisory_xact_lock(?, ?)', [WEATHER_LOCK, siteId]);

/** For each value crossFieldProblems may mark, the values whose change can have caused it. */
const ORDER_PARTNERS = { tMinC: ['tMaxC'], rhMinPct: ['rhMaxPct'], rhMeanPct: ['rhMinPct', 'rhMaxPct'] } as const satisfies Partial<Record<WeatherValueKey, readonly WeatherValueKey[]>>;

/** The 400 for values that break the day's order once merged with what it holds, each on its field. */
function orderRefusal(problems: Partial<Record<WeatherValueKey, string>>): AppError {
  return new AppError('validation_failed', 'Some values do not fit the rest of the day.', problems as Record<string, string>);
}

/**
 * Merges values into one day of a site's log (a value left out keeps what the day holds, null clears
 * it), creating the day when it is new; answers the saved day, whether it was created, and the days changed.
 */
export async function putWeatherDay(
  db: Knex,
  opts: { siteId: number; userId: number; day: string; body: WeatherDayBody; now?: Date },
): Promise<{ day: WeatherDay; created: boolean; changedDays: string[] }> {
  const access = await weatherAccess(db, opts);
  refuseWrite(access);
  assertNotAfterToday(opts.day, access);
  const { source, ...values } = opts.body;
  const incoming = rounded(values);
  return db.transaction(async (trx) => {
    await lockLog(trx, access.site.id);
    const stored: WeatherRow | undefined = await trx('weather_days').where({ site_id: access.site.id, day: opts.day }).first();
    const merged: Partial<WeatherValues> = { ...(stored ? valuesOf(stored) : {}), ...incoming };
    const problems = crossFieldProblems(merged);
    // Name the value that was sent: a gauge's minimum above the stored maximum is the minimum's fault.
    for (const key of Object.keys(problems) as Array<keyof typeof ORDER_PARTNERS>) {
      if (incoming[key] !== undefined) continue;
      const sent = ORDER_PARTNERS[key].find((k) => incoming[k] !== undefined);
      if (sent) {
        problems[sent] = problems[key];
        delete problems[key];
      }
    }
    if (Object.keys(problems).length > 0) throw orderRefusal(problems);
    if (isEmptyDay(merged)) {
      const cleared = weatherValueKeys.find((k) => incoming[k] === null) ?? 'rainMm';
      throw new AppError('validation_failed', 'A day keeps at least one value.', {
        [cleared]: 'A day keeps at least one value; a coordinator can delete the whole day',
      });
    }
    const columns = { ...columnsOf(incoming), source, entered_by_user_id: opts.userId, updated_at: trx.fn.now() };
    if (stored) await trx('weather_days').where({ site_id: access.site.id, day: opts.day }).update(columns);
    else await trx('weather_days').insert({ site_id: access.site.id, day: opts.day, ...columns });
    const saved: WeatherRow = await daysQuery(trx, access.site.id, access.isCoordinator).where('w.day', opts.day).first();
    await replanAfterWeather(trx, access.site.id, [opts.day], opts.now);
    return { day: toDay(saved, access.isCoordinator), created: !stored, changedDays: [opts.day] };
  });
}

/** Deletes one day of a site's log (coordinators only); answers the days changed. */
export async function deleteWeatherDay(db: Knex, opts: { siteId: number; userId: number; day: string; now?: Date }): Promise<{ changedDays: string[] }> {
  const access = await weatherAccess(db, opts);
  if (!access.isCoordinator) throw new AppError('forbidden', 'Only the coordinators can delete a day from the weather log.');
  return db.transaction(async (trx) => {
    await lockLog(trx, access.site.id);
    const removed = await trx('weather_days').where({ site_id: access.site.id, day: opts.day }).delete();
    if (removed === 0) throw notFound(`The weather for ${opts.day}`);
    await replanAfterWeather(trx, access.site.id, [opts.day], opts.now);
    return { changedDays: [opts.day] };
  });
}

/** Stored days of a site, oldest first, for the CSV download (every day when no range is given). */
export async function weatherDaysForCsv(db: Db, opts: { siteId: number; userId: number; from?: string; to?: string; now?: Date }) {
  const access = await weatherAccess(db, opts);
  const q = db('weather_days').where({ site_id: access.site.id }).orderBy('day').select('day', 'source', ...valueColumns);
  if (opts.from) q.where('day', '>=', opts.from);
  if (opts.to) q.where('day', '<=', opts.to);
  const rows: WeatherRow[] = await q;
  return { access, days: rows.map((r) => ({ day: r.day, ...valuesOf(r) })) };
}

export { refuseWrite, WEATHER_LOCK };
