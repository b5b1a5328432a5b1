// Every currency a club can choose has two minor digits (ISO 4217: GBP, EUR, USD, CAD, AUD, NZD),
// so an amount is read to at most two decimal places.
const MINOR_DIGITS = 2;

/** The largest amount a form accepts, in minor units: the schemas' own upper bound (1,000,000.00). */
export const MAX_MONEY_MINOR = 100_000_000;

export type MoneyParse = { ok: true; minor: number } | { ok: false; message: string };

const GROUPED = /^\d{1,3}(,\d{3})+$/;
const PLAIN = /^\d+$/;

/**
 * Reads an amount typed as a decimal in the club currency ("45", "45.5", "1,234.56", "£12.30") into whole
 * minor units with string arithmetic only, so "0.1" is exactly 10 and never 10.000000000000002.
 */
export function parseMoney(input: string): MoneyParse {
  const text = input.trim().replace(/^[£$€]\s*/, '');
  if (text === '') return { ok: false, message: 'Enter an amount' };
  if (/^[-−–]/.test(text)) return { ok: false, message: 'Cannot be negative' };
  const [whole = '', fraction, ...rest] = text.split('.');
  if (rest.length > 0 || (whole === '' && !fraction)) return { ok: false, message: 'Enter an amount like 45.00' };
  if (whole !== '' && !PLAIN.test(whole) && !GROUPED.test(whole)) {
    return { ok: false, message: whole.includes(',') ? 'Put commas only between groups of three digits, like 1,234.56' : 'Enter an amount like 45.00' };
  }
  const frac = fraction ?? '';
  if (!/^\d*$/.test(frac)) return { ok: false, message: 'Enter an amount like 45.00' };
  if (frac.length > MINOR_DIGITS) return { ok: false, message: 'Use at most 2 decimal places (whole pence or cents)' };
  const digits = `${whole.replaceAll(',', '')}${frac.padEnd(MINOR_DIGITS, '0')}`.replace(/^0+(?=\d)/, '');
  if (digits.length > String(MAX_MONEY_MINOR).length) return { ok: false, message: 'At most 1,000,000.00' };
  const minor = Number(digits);
  if (minor > MAX_MONEY_MINOR) return { ok: false, message: 'At most 1,000,000.00' };
  return { ok: true, minor };
}

/** Writes minor units as a plain decimal with two places and no symbol, e.g. 4505 → "45.05", for inputs and CSV files. */
export function minorToDecimal(minor: number): string {
  const sign = minor < 0 ? '-' : '';
  const digits = String(Math.abs(Math.trunc(minor))).padStart(MINOR_DIGITS + 1, '0');
  return `${sign}${digits.slice(0, -MINOR_DIGITS)}.${digits.slice(-MINOR_DIGITS)}`;
}
