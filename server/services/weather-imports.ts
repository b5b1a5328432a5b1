import type { Knex } from 'knex';
import { type UnitSystem, roundTo } from '@shared/geometry';
import {
  WeatherDayTextSchema,
  weatherCsvColumns,
  type WeatherCsvColumn,
  type WeatherImportBody,
  type WeatherImportResult,
} from '@shared/schemas/weather';
import {
  crossFieldProblems,
  isEmptyDay,
  rangeProblem,
  storedSi,
  weatherFromSi,
  weatherQuantities,
  type WeatherQuantity,
  type WeatherValueKey,
  type WeatherValues,
} from '@shared/weather';
import type { Db } from '../db/knex';
import { csvText, importRefusal, readCsvTable, sortProblems } from './csv-files';
import { refuseWrite, WEATHER_LOCK, weatherAccess, weatherDaysForCsv, type WeatherAccess } from './weather';
import { replanAfterWeather } from './tasks';

// File rules, the same as every import (services/csv-files.ts): the header is line 1, names ignore
// case with spaces and dashes read as underscores; comma, semicolon or tab separate cells; decimals use a
// dot; problems name the line and the column. Only `date` is required (YYYY-MM-DD, a day in the site's
// zone, from 2000-01-01 to the site's today). Metric files give °C, mm, m/s and m; US files °F, inches,
// mph and feet; humidity is %, sunshine hours, solar radiation MJ/m² in both. A row needs a value
// besides its date. Each day appears once in a file; a day the log already holds is kept (skip) or
// replaced by the file's row, blanks included (replace), as the person chooses.

/** The most day rows one file may hold. */
export const MAX_WEATHER_IMPORT_ROWS = 2000;

type Problem = WeatherImportResult['errors'][number];
type Row = WeatherImportResult['rows'][number];

const columnOfKey = Object.fromEntries(weatherQuantities.map((q) => [q.key, q.csv])) as Record<WeatherValueKey, WeatherCsvColumn>;

// Names people give these columns in their own spreadsheets, normalised.
const aliases: Record<string, WeatherCsvColumn> = {
  day: 'date',
  tmin: 't_min',
  min_temp: 't_min',
  tmax: 't_max',
  max_temp: 't_max',
  rainfall: 'rain',
  precipitation: 'rain',
  sunshine: 'sunshine_hours',
  solar: 'solar_radiation',
};

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

interface ParsedRow {
  row: number;
  day: string;
  values: WeatherValues | null;
}

/** Reads one record into SI values, or the problems with it. */
function convertRecord(get: (c: WeatherCsvColumn) => string, units: UnitSystem, row: number, access: WeatherAccess) {
  const errors: Problem[] = [];
  const day = get('date');
  if (day === '') errors.push({ row, field: 'date', message: 'Enter the date, like 2026-06-03' });
  else {
    const parsed = WeatherDayTextSchema.safeParse(day);
    if (!parsed.success) errors.push({ row, field: 'date', message: parsed.error.issues[0].message });
    else if (day > access.today) errors.push({ row, field: 'date', message: `After today at ${access.site.name} (${access.today})` });
  }
  const values = {} as WeatherValues;
  for (const q of weatherQuantities) {
    const text = get(q.csv as WeatherCsvColumn);
    values[q.key] = null;
    if (text === '') continue;
    if (!NUMBER.test(text)) {
      errors.push({ row, field: q.csv, message: 'Enter a number, like 2.5 (with a dot for decimals)' });
      continue;
    }
    const problem = rangeProblem(q, Number(text), units);
    if (problem) errors.push({ row, field: q.csv, message: problem });
    else values[q.key] = storedSi(q, Number(text), units);
  }
  const failed = new Set(errors.map((e) => e.field));
  for (const [key, message] of Object.entries(crossFieldProblems(values)) as Array<[WeatherValueKey, string]>) {
    if (!failed.has(columnOfKey[key])) errors.push({ row, field: columnOfKey[key], message });
  }
  if (errors.length === 0 && isEmptyDay(values)) errors.push({ row, field: '', message: 'The row has a date but no values' });
  return { day, values: errors.length === 0 ? values : null, errors };
}

/** Reads a weather CSV into days in SI, with every problem that needs no database to find. */
export function parseWeatherCsv(csv: string, units: UnitSystem, access: WeatherAccess): { rows: ParsedRow[]; errors: Problem[] } {
  const table = readCsvTable<WeatherCsvColumn>(csv, {
    columns: weatherCsvColumns,
    required: ['date'],
    noun: 'day',
    maxRows: MAX_WEATHER_IMPORT_ROWS,
    aliases,
    tooManyRows: (count, max) => `The file has ${count} day rows; import at most ${max} at a time`,
  });
  const errors = [...table.errors];
  const rows: ParsedRow[] = [];
  const firstLineOf = new Map<string, number>();
  for (const record of table.rows) {
    if (table.unreadable) {
      rows.push({ row: record.line, day: record.get('date'), values: null });
      continue;
    }
    const converted = convertRecord(record.get, units, record.line, access);
    if (record.strays) converted.errors.push({ row: record.line, field: '', message: 'This row has a value in a column without a name' });
    errors.push(...converted.errors);
    const day = converted.day;
    if (day && WeatherDayTextSchema.safeParse(day).success) {
      const first = firstLineOf.get(day);
      if (first !== undefined) errors.push({ row: record.line, field: 'date', message: `The day ${day} is on lines ${first} and ${record.line}; keep one of them` });
      else firstLineOf.set(day, record.line);
    }
    rows.push({ row: record.line, day, values: record.strays ? null : converted.values });
  }
  return { rows, errors };
}

/** Which of the file's days the log already holds. */
async function storedDays(db: Db, siteId: number, days: string[]): Promise<Set<string>> {
  const found = new Set<string>();
  for (let i = 0; i < days.length; i += 1000) {
    const chunk = days.slice(i, i + 1000);
    const rows: Array<{ day: string }> = await db('weather_days').where({ site_id: siteId }).whereIn('day', chunk).select('day');
    for (const r of rows) found.add(r.day);
  }
  return found;
}

function withStatus(rows: ParsedRow[], stored: Set<string>, duplicates: WeatherImportBody['duplicates']) {
  const out: Row[] = rows.map((r) => ({
    row: r.row,
    day: r.day,
    values: r.values,
    status: r.values === null ? null : stored.has(r.day) ? (duplicates === 'replace' ? 'replace' : 'skip') : 'new',
  }));
  const count = (s: Row['status']) => out.filter((r) => r.status === s).length;
  return { rows: out, counts: { new: count('new'), replaced: count('replace'), skipped: count('skip') } };
}

/**
 * Checks a weather CSV against a site's log and, with commit, saves every row or none: any problem
 * refuses the whole file with 400 and the problems by line and column. New days are added; a day the
 * log holds is kept (skip) or replaced by the file's row (replace). Answers the days written.
 */
export async function importWeather(
  db: Knex,
  opts: { siteId: number; userId: number; now?: Date } & WeatherImportBody,
): Promise<WeatherImportResult> {
  const access = await weatherAccess(db, opts);
  refuseWrite(access);
  const parsed = parseWeatherCsv(opts.csv, opts.units, access);
  const errors = sortProblems(parsed.errors, weatherCsvColumns);
  const days = parsed.rows.filter((r) => r.values !== null).map((r) => r.day);

  if (!opts.commit) {
    const { rows, counts } = withStatus(parsed.rows, await storedDays(db, access.site.id, days), opts.duplicates);
    return { rows, errors, counts, committed: false, changedDays: [] };
  }
  if (errors.length > 0) throw importRefusal(errors);
  return db.transaction(async (trx) => {
    // With the log locked, a day typed in meanwhile is counted as stored, not overwritten unasked.
    await trx.raw('select pg_advisory_xact_lock(?, ?)', [WEATHER_LOCK, access.site.id]);
    const { rows, counts } = withStatus(parsed.rows, await storedDays(trx, access.site.id, days), opts.duplicates);
    const writes = rows.filter((r) => r.status === 'new' || r.status === 'replace');
    const columns = weatherQuantities.map((q) => q.column);
    for (let i = 0; i < writes.length; i += 500) {
      const chunk = writes.slice(i, i + 500).map((r) => ({
        site_id: access.site.id,
        day: r.day,
        ...Object.fromEntries(weatherQuantities.map((q) => [q.column, r.values![q.key]])),
        source: 'import',
        entered_by_user_id: opts.userId,
      }));
      await trx('weather_days')
        .insert(chunk)
        .onConflict(['site_id', 'day'])
        // The stored day becomes the file's row, blanks included; updated_at is the insert's default (now).
        .merge([...columns, 'source', 'entered_by_user_id', 'updated_at']);
    }
    const changedDays = writes.map((r) => r.day).sort();
    await replanAfterWeather(trx, access.site.id, changedDays);
    return { rows, errors: [], counts, committed: true, changedDays };
  });
}

/**
 * How many decimals a value is written with in a CSV: the column's own in SI; after a US conversion
 * enough that the file imports back to the same stored value (half a last digit in °F, mph or ft is
 * under half the column's step; rain needs five decimals of an inch, since 0.00005 in = 0.00127 mm).
 */
function csvDecimals(q: WeatherQuantity, units: UnitSystem): number {
  if (units === 'metric') return q.decimals;
  if (q.kind === 'rain') return 5;
  return q.kind === 'temperature' || q.kind === 'speed' || q.kind === 'height' ? q.decimals + 1 : q.decimals;
}

/** A stored value as written in a CSV of the given units. */
function csvValue(q: WeatherQuantity, value: number | null, units: UnitSystem): string | number {
  return value === null ? '' : roundTo(weatherFromSi(q.kind, value, units), csvDecimals(q, units));
}

/** A site's log as CSV in the import's own columns and the given units (the site's by default), oldest first. */
export async function exportWeatherCsv(
  db: Db,
  opts: { siteId: number; userId: number; units?: UnitSystem; from?: string; to?: string; now?: Date },
): Promise<{ siteName: string; csv: string }> {
  const { access, days } = await weatherDaysForCsv(db, opts);
  const units = opts.units ?? access.site.units;
  return {
    siteName: access.site.name,
    csv: csvText(
      weatherCsvColumns,
      days.map((d) => [d.day, ...weatherQuantities.map((q) => csvValue(q, d[q.key], units))]),
    ),
  };
}

/** A starting file for an import: the header and three example days in the given units (a full day, a gauge day, a day with temperatures only). */
export function weatherTemplateCsv(units: UnitSystem): string {
  const rows =
    units === 'us'
      ? [
          ['2026-06-01', 51.8, 71.6, 0.12, 48, 94, 70, 6.7, 6.5, 7.5, 21.4],
          ['2026-06-02', '', '', 0.45, '', '', '', '', '', '', ''],
          ['2026-06-03', 50, 68, '', '', '', '', '', '', '', ''],
        ]
      : [
          ['2026-06-01', 11, 22, 3, 48, 94, 70, 3, 2, 7.5, 21.4],
          ['2026-06-02', '', '', 11.4, '', '', '', '', '', '', ''],
          ['2026-06-03', 10, 20, '', '', '', '', '', '', '', ''],
        ];
  return csvText(weatherCsvColumns, rows);
}
