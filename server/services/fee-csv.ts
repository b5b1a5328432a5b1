import Papa from 'papaparse';
import { minorToDecimal } from '@shared/fees/money';
import type { FeesQuery } from '@shared/schemas/fees';
import type { Db } from '../db/knex';
import { listFees } from './fee-ledger';

// Text cells that a spreadsheet would run as a formula get a leading apostrophe (OWASP, "CSV Injection").
const FORMULA_START = /^[=+\-@\t\r]/;
const textCell = (s: string) => (FORMULA_START.test(s) ? `'${s}` : s);

export const feeCsvColumns = [
  'season',
  'holder',
  'email',
  'site',
  'plot',
  'description',
  'currency',
  'plot_fee',
  'deposit',
  'concession',
  'due_on',
  'paid',
  'refunded',
  'deposit_held',
  'balance',
] as const;

/** The club's fees as CSV, amounts as decimals with two places in each fee's currency, in the list's order. */
export async function exportFeesCsv(db: Db, clubId: number, query: FeesQuery): Promise<string> {
  const { items } = await listFees(db, clubId, query);
  const data = items.map((f) => [
    f.seasonYear,
    textCell(f.holderName),
    textCell(f.holderEmail),
    textCell(f.siteName),
    textCell(f.plotLabel),
    textCell(f.description),
    f.currency,
    minorToDecimal(f.plotFeeMinor),
    minorToDecimal(f.depositMinor),
    f.isConcession ? 'yes' : 'no',
    f.dueOn,
    minorToDecimal(f.paidMinor),
    minorToDecimal(f.refundedMinor),
    minorToDecimal(f.depositHeldMinor),
    minorToDecimal(f.balanceMinor),
  ]);
  return Papa.unparse({ fields: [...feeCsvColumns], data }, { newline: '\r\n' });
}

