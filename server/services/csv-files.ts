import Papa from 'papaparse';
import { EmailSchema } from '@shared/schemas/common';
import type { ImportProblem } from '@shared/schemas/member-imports';
import { AppError } from '../errors';

// One set of file rules for every import (plots, members, waiting list): the header is line 1 and names
// ignore case (spaces and dashes read as underscores); comma, semicolon or tab separate cells;
// problems name the line.

// Exports put a quote before a cell a spreadsheet would run as a formula (OWASP "CSV injection");
// reading one back takes the quote off again.
const FORMULA_START = /^[=+\-@\t\r]/;

export interface CsvRecord {
  /** The line in the file where the record starts (the header is line 1). */
  line: number;
  cells: string[];
}

/** Normalises a header cell the way imports match it. */
export function normaliseHeader(h: string): string {
  return h
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, '_');
}

/** Splits CSV text into records, each with the line it starts on, dropping lines with no content. */
export function readCsvRecords(csv: string): { records: CsvRecord[]; errors: ImportProblem[] } {
  const text = csv.replace(/^\uFEFF/, '');
  const records: CsvRecord[] = [];
  const errors: ImportProblem[] = [];
  let start = 0;
  let scanned = 0;
  let line = 1;
  const lineAt = (offset: number) => {
    for (; scanned < offset; scanned++) {
      const ch = text.charCodeAt(scanned);
      // \r\n and \n each end a line, and so does a lone \r (old spreadsheet exports).
      if (ch === 10 || (ch === 13 && text.charCodeAt(scanned + 1) !== 10)) line++;
    }
    return line;
  };
  Papa.parse<string[]>(text, {
    delimitersToGuess: [',', ';', '\t'],
    skipEmptyLines: false,
    step: (result) => {
      const at = lineAt(start);
      start = result.meta.cursor;
      for (const e of result.errors) {
        if (e.type === 'Quotes') {
          errors.push({ row: at, field: '', message: 'A quoted cell is not closed, or a quote sits inside an unquoted cell' });
        }
      }
      if (result.data.some((c) => c.trim() !== '')) records.push({ line: at, cells: result.data });
    },
  });
  return { records, errors };
}

export interface CsvTable<C extends string> {
  /** The data records with a getter of each known column's trimmed text. */
  rows: Array<{ line: number; get: (c: C) => string; strays: boolean }>;
  errors: ImportProblem[];
  /** True when a required column is missing, so rows cannot be read at all. */
  unreadable: boolean;
}

/** Reads a CSV whose header names known columns, reporting unknown, repeated and missing columns on line 1. */
export function readCsvTable<C extends string>(
  csv: string,
  opts: {
    columns: readonly C[];
    required: readonly C[];
    noun: string;
    maxRows: number;
    /** Other header names people write for a column, normalised ("e_mail" for email). */
    aliases?: Record<string, C>;
    /** The problem for a file over maxRows, when the import words it its own way. */
    tooManyRows?: (count: number, max: number) => string;
  },
): CsvTable<C> {
  const { records, errors } = readCsvRecords(csv);
  const [header, ...data] = records;
  if (!header) return { rows: [], errors: [{ row: 1, field: '', message: 'The file has no header line' }], unreadable: true };

  const index = new Map<C, number>();
  const unnamed = new Set<number>();
  header.cells.forEach((cell, i) => {
    const written = normaliseHeader(cell);
    const name = opts.aliases?.[written] ?? written;
    if (name === '') unnamed.add(i);
    else if (!(opts.columns as readonly string[]).includes(name)) {
      errors.push({ row: 1, field: cell.trim(), message: `Unknown column "${cell.trim()}"; the columns are ${opts.columns.join(', ')}` });
    } else if (index.has(name as C)) {
      errors.push({ row: 1, field: name, message: `The column "${name}" appears more than once` });
    } else index.set(name as C, i);
  });
  const missing = opts.required.filter((c) => !index.has(c));
  for (const c of missing) errors.push({ row: 1, field: c, message: `The required column "${c}" is missing` });
  if (data.length === 0) errors.push({ row: 1, field: '', message: `The file has no ${opts.noun} rows under the header` });
  if (data.length > opts.maxRows) {
    const message = opts.tooManyRows?.(data.length, opts.maxRows) ?? `The file has ${data.length} rows; import at most ${opts.maxRows} at a time`;
    errors.push({ row: 1, field: '', message });
    return { rows: [], errors, unreadable: true };
  }
  const rows = data.map((record) => ({
    line: record.line,
    get: (c: C) => {
      const i = index.get(c);
      return i === undefined ? '' : (record.cells[i] ?? '').trim();
    },
    strays: record.cells.some((c, i) => c.trim() !== '' && (i >= header.cells.length || unnamed.has(i))),
  }));
  return { rows, errors, unreadable: missing.length > 0 };
}

/** A text cell as typed, without the quote an export put before formula-like text. */
export function unguard(text: string): string {
  return text.startsWith("'") && FORMULA_START.test(text.slice(1)) ? text.slice(1) : text;
}

const yesWords = new Set(['yes', 'true', '1', 'y']);
const noWords = new Set(['no', 'false', '0', 'n']);

/** yes/no, true/false or 1/0; blank is the default; anything else is null (a problem to report). */
export function readYesNo(text: string, blank = false): boolean | null {
  const word = text.toLowerCase();
  if (word === '') return blank;
  if (yesWords.has(word)) return true;
  if (noWords.has(word)) return false;
  return null;
}

/** Lower-case letters and digits only, so "Plot holder", "plot-holder" and "PLOT_HOLDER" all match. */
export const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

/** CSV text with the given header, CRLF lines, and formula-like cells guarded for spreadsheets. */
export function csvText(fields: readonly string[], rows: Array<Array<string | number>>): string {
  return Papa.unparse({ fields: [...fields], data: rows }, { newline: '\r\n', escapeFormulae: FORMULA_START });
}

const byPosition = (order: readonly string[]) => {
  const at = new Map<string, number>(order.map((c, i) => [c, i + 1]));
  return (p: ImportProblem, q: ImportProblem) => p.row - q.row || (at.get(p.field) ?? 0) - (at.get(q.field) ?? 0);
};

/** At most this many problems are reported for one file; the rest are counted in one closing line. */
export const MAX_REPORTED_PROBLEMS = 100;

/**
 * Problems sorted by line, then in column order: the first MAX_REPORTED_PROBLEMS of them and,
 * when there are more, one closing problem on row 0 that counts the rest. A file of 2,000 bad
 * rows then answers in kilobytes, not hundreds of megabytes.
 */
export function sortProblems(problems: ImportProblem[], columns: readonly string[]): ImportProblem[] {
  const sorted = [...problems].sort(byPosition(columns));
  if (sorted.length <= MAX_REPORTED_PROBLEMS) return sorted;
  const rest = sorted.length - MAX_REPORTED_PROBLEMS;
  const restRows = new Set(sorted.slice(MAX_REPORTED_PROBLEMS).map((p) => p.row)).size;
  return [
    ...sorted.slice(0, MAX_REPORTED_PROBLEMS),
    {
      row: 0,
      field: '',
      message: `…and ${rest} more ${rest === 1 ? 'problem' : 'problems'} on ${restRows} ${restRows === 1 ? 'row' : 'rows'} not listed here. Fix these first, then check again.`,
    },
  ];
}

/** The 400 a refused commit answers: fields keyed "row N.column" (or "row N" for the whole row or file). */
export function importRefusal(errors: ImportProblem[]): AppError {
  const fields: Record<string, string> = {};
  for (const e of errors) {
    const key = e.field ? `row ${e.row}.${e.field}` : `row ${e.row}`;
    fields[key] = fields[key] ? `${fields[key]}; ${e.message}` : e.message;
  }
  const badRows = new Set(errors.filter((e) => e.row > 1).map((e) => e.row)).size;
  const message =
    badRows === 0
      ? 'The file has problems; nothing was imported.'
      : `${badRows} ${badRows === 1 ? 'row has' : 'rows have'} problems; nothing was imported.`;
  return new AppError('validation_failed', message, fields);
}

// Files of people (members, waitlist) share these.
export const emailAliases = { e_mail: 'email', email_address: 'email', e_mail_address: 'email' } as const;

/** An e-mail address cell, or the problem with it. */
export function readEmail(text: string): { email: string } | { problem: string } {
  if (text === '') return { problem: 'Enter an e-mail address' };
  const parsed = EmailSchema.safeParse(text);
  return parsed.success ? { email: parsed.data } : { problem: parsed.error.issues[0].message };
}

/** Marks the later rows of an address used twice in the file. */
export function duplicateRows(rows: Array<{ row: number; email: string }>): ImportProblem[] {
  const first = new Map<string, number>();
  const problems: ImportProblem[] = [];
  for (const r of rows) {
    if (!r.email) continue;
    const at = first.get(r.email);
    if (at !== undefined) problems.push({ row: r.row, field: 'email', message: `The address ${r.email} is also on row ${at}` });
    else first.set(r.email, r.row);
  }
  return problems;
}
