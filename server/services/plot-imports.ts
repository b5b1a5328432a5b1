import type { Knex } from 'knex';
import {
  DEFAULT_EPS,
  feetToMetres,
  firstOverlaps,
  footprint,
  formatLength,
  METRES_PER_INCH,
  metresToFeet,
  roundTo,
  type UnitSystem,
} from '@shared/geometry';
import {
  PlotCreateBodySchema,
  plotCsvColumns,
  plotKindLabels,
  plotKinds,
  sunLabels,
  sunValues,
  type PlotCreateBody,
  type PlotImportResult,
} from '@shared/schemas/plots';
import { notFound } from '../errors';
import type { Db } from '../db/knex';
import { plotColumns, STORED_LENGTH_EPS, type PlotRow } from '../db/mappers';
import { csvText, importRefusal, readCsvTable, readYesNo, sortProblems, squash, unguard } from './csv-files';
import { recordPlotEvent } from './plot-events';

// File rules, kept in one place so the template, the export and the README agree:
// - the first non-empty line is the header; names are matched ignoring case, with spaces and
//   dashes read as underscores ("Soil depth" = soil_depth);
// - comma, semicolon or tab separated; decimals use a dot;
// - metric files give x, y, width, length and soil_depth in metres; US files give x, y, width
//   and length in feet and soil_depth in inches (how US growers state bed depth, common practice);
// - lengths are kept to the millimetre and soil depth to the centimetre, as the database stores them;
// - error rows are physical line numbers, the header line being 1.

/** The most plot rows one file may hold. */
export const MAX_IMPORT_ROWS = 2000;
/** Overlaps counted per row before the message says "at least". */
const OVERLAP_COUNT_LIMIT = 10;

type Column = (typeof plotCsvColumns)[number];
type BodyKey = keyof PlotCreateBody;
export type ImportError = PlotImportResult['errors'][number];

const REQUIRED: readonly Column[] = ['label', 'x', 'y', 'width', 'length'];
const LENGTHS: readonly Column[] = ['x', 'y', 'width', 'length'];

const bodyKeyOf: Record<Column, BodyKey> = {
  label: 'label',
  x: 'x',
  y: 'y',
  width: 'width',
  length: 'length',
  rotation: 'rotation',
  kind: 'kind',
  soil_depth: 'soilDepth',
  soil_ph: 'soilPh',
  soil_tested_on: 'soilTestedOn',
  sun: 'sun',
  accessible: 'isAccessible',
  water_tap: 'hasWaterTap',
  notes: 'notes',
};
const columnOf = Object.fromEntries(Object.entries(bodyKeyOf).map(([c, k]) => [k, c])) as Record<BodyKey, Column>;

function lookup<T extends string>(values: readonly T[], labels: Record<T, string>, extra: Record<string, T> = {}) {
  const map = new Map<string, T>(Object.entries(extra).map(([k, v]) => [squash(k), v]));
  for (const v of values) {
    map.set(squash(v), v);
    map.set(squash(labels[v]), v);
  }
  return map;
}

const kindWords = lookup(plotKinds, plotKindLabels, {
  'in ground': 'in_ground',
  'raised bed': 'raised_bed',
  raised: 'raised_bed',
  'shared bed': 'shared_bed',
  shared: 'shared_bed',
  pot: 'container',
});
const sunWords = lookup(sunValues, sunLabels, { 'part sun': 'part', partial: 'part', 'full shade': 'shade' });
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

function parseNumber(text: string): number | string {
  return NUMBER.test(text) ? Number(text) : 'Enter a number, like 2.5 (with a dot for decimals)';
}

interface ParsedRow {
  row: number;
  label: string;
  plot: PlotCreateBody | null;
}

/** Turns one record's cells into a plot body in metres, or the problems with it. */
function convertRecord(get: (c: Column) => string, units: UnitSystem, row: number) {
  const errors: ImportError[] = [];
  const input: Partial<Record<BodyKey, unknown>> = {};
  const bad = (column: Column, message: string) => errors.push({ row, field: column, message });
  for (const column of plotCsvColumns) {
    const text = get(column);
    const key = bodyKeyOf[column];
    if (text === '') {
      if (REQUIRED.includes(column)) bad(column, column === 'label' ? 'Enter a label' : 'Enter a value');
      continue; // an optional blank takes the same default as a plot drawn on the map
    }
    switch (column) {
      case 'label':
        input.label = text;
        break;
      case 'x':
      case 'y':
      case 'width':
      case 'length':
      case 'rotation':
      case 'soil_depth':
      case 'soil_ph': {
        const n = parseNumber(text);
        if (typeof n === 'string') {
          bad(column, n);
          break;
        }
        if (LENGTHS.includes(column)) input[key] = roundTo(units === 'us' ? feetToMetres(n) : n, 3);
        else if (column === 'soil_depth') input[key] = roundTo(units === 'us' ? n * METRES_PER_INCH : n, 2);
        else if (column === 'soil_ph') input[key] = roundTo(n, 1);
        else input[key] = n;
        break;
      }
      case 'kind':
      case 'sun': {
        const words = column === 'kind' ? kindWords : sunWords;
        const value = words.get(squash(text));
        if (value) input[key] = value;
        else bad(column, `Use one of: ${(column === 'kind' ? plotKinds : sunValues).join(', ')}`);
        break;
      }
      case 'accessible':
      case 'water_tap': {
        const value = readYesNo(text);
        if (value === null) bad(column, 'Use yes or no');
        else input[key] = value;
        break;
      }
      case 'soil_tested_on':
        input.soilTestedOn = text;
        break;
      case 'notes':
        input.notes = unguard(text);
        break;
    }
  }
  const failed = new Set(errors.map((e) => e.field));
  const parsed = PlotCreateBodySchema.safeParse(input);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const column = columnOf[issue.path[0] as BodyKey] ?? '';
      if (failed.has(column)) continue;
      failed.add(column);
      errors.push({ row, field: column, message: issue.message });
    }
  }
  return { plot: parsed.success && errors.length === 0 ? parsed.data : null, errors };
}

/** Reads a plot CSV into plot bodies in metres, with every problem that needs no database to find. */
export function parsePlotCsv(csv: string, units: UnitSystem): { rows: ParsedRow[]; errors: ImportError[] } {
  const table = readCsvTable<Column>(csv, {
    columns: plotCsvColumns,
    required: REQUIRED,
    noun: 'plot',
    maxRows: MAX_IMPORT_ROWS,
    tooManyRows: (count, max) => `The file has ${count} plot rows; import at most ${max} at a time`,
  });
  const errors = [...table.errors];
  const rows: ParsedRow[] = [];
  for (const record of table.rows) {
    const label = record.get('label');
    // A file without its required columns gets one message per column, not one per row.
    if (table.unreadable) {
      rows.push({ row: record.line, label, plot: null });
      continue;
    }
    const converted = convertRecord(record.get, units, record.line);
    if (record.strays) converted.errors.push({ row: record.line, field: '', message: 'This row has a value in a column without a name' });
    errors.push(...converted.errors);
    rows.push({ row: record.line, label, plot: record.strays ? null : converted.plot });
  }
  return { rows, errors };
}

interface SiteBounds {
  id: number;
  width_m: number;
  length_m: number;
}

/** Problems that depend on the site: labels already used, plots off the site, plots on top of each other. */
function placementErrors(rows: ParsedRow[], site: SiteBounds, existing: PlotRow[], units: UnitSystem): ImportError[] {
  const errors: ImportError[] = [];
  const taken = new Map(existing.map((p) => [p.label.toLowerCase(), p.label]));
  const firstRowOf = new Map<string, number>();
  for (const r of rows) {
    if (!r.label) continue;
    const key = r.label.toLowerCase();
    const first = firstRowOf.get(key);
    if (first !== undefined) {
      errors.push({ row: r.row, field: 'label', message: `The label ${r.label} is also used on row ${first}` });
    } else firstRowOf.set(key, r.row);
    if (taken.has(key)) {
      errors.push({ row: r.row, field: 'label', message: `Plot ${taken.get(key)} already exists on this site` });
    }
  }

  const placed = rows.filter((r): r is ParsedRow & { plot: PlotCreateBody } => r.plot !== null);
  for (const r of placed) {
    const fp = footprint(r.plot);
    if (fp.maxX > site.width_m + DEFAULT_EPS) {
      errors.push({
        row: r.row,
        field: 'x',
        message: `Plot ${r.label} reaches ${formatLength(fp.maxX, units)} east, past the edge of the site (${formatLength(site.width_m, units)} wide)`,
      });
    }
    if (fp.maxY > site.length_m + DEFAULT_EPS) {
      errors.push({
        row: r.row,
        field: 'y',
        message: `Plot ${r.label} reaches ${formatLength(fp.maxY, units)} south, past the edge of the site (${formatLength(site.length_m, units)} long)`,
      });
    }
  }

  // Saved plots first, then rows by line: each row is told the earliest plot it overlaps, once,
  // with a count of the others (a grid index keeps 2,000 rows on one spot cheap).
  const rects = [
    ...existing.map((p) => ({ x: p.x_m, y: p.y_m, width: p.width_m, length: p.length_m, rotation: p.rotation })),
    ...placed.map((r) => r.plot),
  ];
  const found = firstOverlaps(rects, STORED_LENGTH_EPS, OVERLAP_COUNT_LIMIT);
  placed.forEach((r, k) => {
    const hit = found[existing.length + k];
    if (!hit) return;
    const other =
      hit.with < existing.length
        ? `plot ${existing[hit.with].label}, already on the site`
        : `plot ${placed[hit.with - existing.length].label} on row ${placed[hit.with - existing.length].row}`;
    const more =
      hit.count > 1
        ? ` and ${hit.count >= OVERLAP_COUNT_LIMIT ? `at least ${hit.count - 1}` : hit.count - 1} more above it`
        : '';
    errors.push({ row: r.row, field: 'x', message: `Plot ${r.label} overlaps ${other}${more}; plots may touch but not overlap` });
  });
  return errors;
}

const livePlots = (db: Db, siteId: number): Promise<PlotRow[]> =>
  db('plots').where({ site_id: siteId }).whereNull('deleted_at').orderByRaw('lower(label)').orderBy('id');

/**
 * Checks a plot CSV against a site and, with commit, saves every row or none: any problem
 * refuses the whole file with 400 and the problems by row and column.
 */
export async function importPlots(
  db: Knex,
  opts: { siteId: number; userId: number; csv: string; units: UnitSystem; commit: boolean },
): Promise<PlotImportResult> {
  const parsed = parsePlotCsv(opts.csv, opts.units);
  const check = async (trx: Db, lock: boolean) => {
    const q = trx('sites').where({ id: opts.siteId });
    const site: SiteBounds | undefined = await (lock ? q.forUpdate() : q).first('id', 'width_m', 'length_m');
    if (!site) throw notFound('The site');
    const existing = await livePlots(trx, opts.siteId);
    return sortProblems([...parsed.errors, ...placementErrors(parsed.rows, site, existing, opts.units)], plotCsvColumns);
  };

  if (!opts.commit) {
    return { rows: parsed.rows, errors: await check(db, false), committed: false, created: 0 };
  }
  return db.transaction(async (trx) => {
    // With the site locked, no plot drawn on the map meanwhile can slip between the check and the insert.
    const errors = await check(trx, true);
    if (errors.length > 0) throw importRefusal(errors);
    const bodies = parsed.rows.map((r) => r.plot!);
    const created: Array<{ id: number; label: string }> = [];
    for (let i = 0; i < bodies.length; i += 500) {
      const chunk = bodies.slice(i, i + 500).map((b) => ({ site_id: opts.siteId, ...plotColumns(b) }));
      created.push(...(await trx('plots').insert(chunk).returning(['id', 'label'])));
    }
    for (const p of created) {
      await recordPlotEvent(trx, { plotId: p.id, userId: opts.userId, kind: 'imported', details: { label: p.label } });
    }
    return { rows: parsed.rows, errors: [], committed: true, created: created.length };
  });
}

const yesNo = (v: boolean) => (v ? 'yes' : 'no');

/** A site's live plots as CSV in the import's own columns, lengths in the given units, so the file imports back unchanged. */
export async function exportPlotsCsv(db: Db, siteId: number, units: UnitSystem): Promise<string> {
  const site = await db('sites').where({ id: siteId }).first('id');
  if (!site) throw notFound('The site');
  const length = (m: number) => (units === 'us' ? roundTo(metresToFeet(m), 4) : roundTo(m, 3));
  const depth = (m: number | null) => (m === null ? '' : units === 'us' ? roundTo(m / METRES_PER_INCH, 3) : roundTo(m, 2));
  const plots = await livePlots(db, siteId);
  return csvText(
    plotCsvColumns,
    plots.map((p) => [
      p.label,
      length(p.x_m),
      length(p.y_m),
      length(p.width_m),
      length(p.length_m),
      p.rotation,
      p.kind,
      depth(p.soil_depth_m),
      p.soil_ph ?? '',
      p.soil_tested_on ?? '',
      p.sun,
      yesNo(p.is_accessible),
      yesNo(p.has_water_tap),
      p.notes,
    ]),
  );
}

/** A starting file for an import: the header and two example plots, in the given units. */
export function plotImportTemplateCsv(units: UnitSystem): string {
  const rows =
    units === 'us'
      ? [
          ['A-1', 0, 0, 10, 20, 0, 'in_ground', '', 6.5, '2026-03-14', 'full', 'no', 'yes', 'Tap at the north end'],
          ['B-1', 12, 0, 4, 8, 90, 'raised_bed', 12, '', '', 'part', 'yes', 'no', 'Wheelchair height, 12 in of soil'],
        ]
      : [
          ['A-1', 0, 0, 3, 6, 0, 'in_ground', '', 6.5, '2026-03-14', 'full', 'no', 'yes', 'Tap at the north end'],
          ['B-1', 4, 0, 1.2, 2.4, 90, 'raised_bed', 0.3, '', '', 'part', 'yes', 'no', 'Wheelchair height, 30 cm of soil'],
        ];
  return csvText(plotCsvColumns, rows);
}
