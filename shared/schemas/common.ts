import { z } from 'zod';

/** A page of a list: every list endpoint answers with this shape. */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), page: z.number().int(), total: z.number().int() });
}

/** The largest number an `integer` column holds: 2^31 − 1 (PostgreSQL manual, "Numeric Types", table 8.2). */
export const MAX_INT4 = 2_147_483_647;

const ID_MESSAGE = 'Must be a whole number from 1 to 2147483647';

/** A record id in a JSON body: a whole number that fits the integer id columns. */
export const IdSchema = z.number(ID_MESSAGE).int(ID_MESSAGE).min(1, ID_MESSAGE).max(MAX_INT4, ID_MESSAGE);

/** A record id in a query string or path (text), held to the same range. */
export const IdTextSchema = z.coerce.number(ID_MESSAGE).int(ID_MESSAGE).min(1, ID_MESSAGE).max(MAX_INT4, ID_MESSAGE);

export const IdParamSchema = z.object({ id: IdTextSchema });

/** An id from a route path ("/api/plots/:plotId"), or null when it is not 1 to 2^31 − 1 written in plain digits. */
export function parseIdText(text: unknown): number | null {
  if (typeof text !== 'string' || !/^[1-9]\d{0,9}$/.test(text)) return null;
  const n = Number(text);
  return n <= MAX_INT4 ? n : null;
}

/** A row version for optimistic concurrency; versions live in integer columns too. */
export const VersionSchema = z.number().int().min(1).max(MAX_INT4, 'Not a version this record can have');

// C0 control characters and DEL. PostgreSQL text cannot hold NUL at all (PostgreSQL manual, "Character
// Types"); the others are never typed and only confuse mail headers and CSV exports. Multi-line text
// keeps tab, line feed and carriage return.
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_IN_LINE = /[\u0000-\u001f\u007f]/;
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_IN_TEXT = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;

export const CONTROL_CHARACTER_MESSAGE = 'Remove the control character (such as NUL) from this text';

/**
 * A text field: trimmed (unless trim is false), refusing control characters (and line breaks unless
 * multiline), with an optional minimum and a maximum length. Every text field of a body uses this.
 */
export function textSchema(opts: {
  max: number;
  min?: number;
  minMessage?: string;
  maxMessage?: string;
  multiline?: boolean;
  trim?: boolean;
}) {
  const control = opts.multiline ? CONTROL_IN_TEXT : CONTROL_IN_LINE;
  let s = z.string();
  if (opts.trim !== false) s = s.trim();
  s = s.refine((v) => !control.test(v), opts.multiline ? CONTROL_CHARACTER_MESSAGE : `${CONTROL_CHARACTER_MESSAGE}; keep it on one line`);
  if (opts.min !== undefined) s = s.min(opts.min, opts.minMessage ?? (opts.min === 1 ? 'Enter some text' : `At least ${opts.min} characters`));
  return s.max(opts.max, opts.maxMessage ?? `At most ${opts.max} characters`);
}

/** The text of an uploaded CSV file: refuses a file holding NUL or another control character, naming its line. */
export function csvFileSchema(maxChars: number, maxMessage: string) {
  return z
    .string()
    .min(1, 'The file is empty')
    .max(maxChars, maxMessage)
    .superRefine((csv, ctx) => {
      const at = csv.search(CONTROL_IN_TEXT);
      if (at < 0) return;
      let line = 1;
      for (let i = 0; i < at; i++) {
        const ch = csv.charCodeAt(i);
        // \r\n and \n each end a line, and so does a lone \r, as the import counts lines.
        if (ch === 10 || (ch === 13 && csv.charCodeAt(i + 1) !== 10)) line++;
      }
      const code = csv.charCodeAt(at);
      const what = code === 0 ? 'a NUL character' : `a control character (U+${code.toString(16).toUpperCase().padStart(4, '0')})`;
      ctx.addIssue({
        code: 'custom',
        message: `Line ${line} holds ${what}; save the file again as plain CSV text (UTF-8) and import it once more`,
      });
    });
}

const DAY_MS = 24 * 60 * 60 * 1000;
const isoDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/**
 * A calendar date (YYYY-MM-DD) from `earliest` to `daysAhead` days after today (UTC, so a day of slack
 * covers every time zone), read when the value is parsed.
 */
export function dateWithinSchema(opts: { earliest: string; daysAhead: number; message: string; tooLateMessage?: string }) {
  return z.iso
    .date(opts.message)
    .refine((d) => d >= opts.earliest, `On or after ${opts.earliest}`)
    .refine((d) => d <= isoDay(Date.now() + (opts.daysAhead + 1) * DAY_MS), opts.tooLateMessage ?? 'Too far in the future');
}

/** An instant with its offset, from the year 2000 up to the end of 2100 (the years a season can have). */
export function instantSchema(message: string) {
  return z.iso
    .datetime({ offset: true, message })
    .refine((s) => {
      const ms = Date.parse(s);
      return ms >= Date.UTC(2000, 0, 1) && ms < Date.UTC(2101, 0, 1);
    }, 'Between the years 2000 and 2100');
}

export const EmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'E-mail address is too long')
  .pipe(z.email('Enter a valid e-mail address'));

export const PasswordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');
