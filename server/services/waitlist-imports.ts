import type { Knex } from 'knex';
import { ApplicationBodySchema, preferredSizes, type ApplicationBody } from '@shared/schemas/applications';
import {
  MAX_MEMBER_IMPORT_ROWS,
  waitlistCsvColumns,
  type ImportedWaitlistEntry,
  type ImportProblem,
  type WaitlistImportResult,
} from '@shared/schemas/member-imports';
import type { Db } from '../db/knex';
import { csvText, duplicateRows, emailAliases, importRefusal, readCsvTable, readYesNo, sortProblems, squash, unguard } from './csv-files';

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

type WaitlistColumn = (typeof waitlistCsvColumns)[number];

const sizeWords = new Map<string, ApplicationBody['preferredSize']>([
  ...preferredSizes.map((s) => [s, s] as const),
  ['anysize', 'any'],
  ['', 'any'],
]);

const columnOfKey: Partial<Record<keyof ApplicationBody, WaitlistColumn>> = {
  name: 'name',
  email: 'email',
  phone: 'phone',
  notes: 'notes',
};

const EARLIEST_APPLIED_ON = '1900-01-01';

function readDate(text: string, today: string): string | { problem: string } {
  const m = DATE.exec(text);
  const valid = m && new Date(`${text}T00:00:00Z`).toISOString().slice(0, 10) === text;
  if (!valid) return { problem: 'Enter a date like 2024-03-15' };
  // The database has no year 0, and nobody on a list today applied before this.
  if (text < EARLIEST_APPLIED_ON) return { problem: `On or after ${EARLIEST_APPLIED_ON}` };
  if (text > today) return { problem: 'Cannot be in the future' };
  return text;
}

interface ParsedEntry {
  row: number;
  name: string;
  email: string;
  entry: ImportedWaitlistEntry | null;
}

function parseWaitlistCsv(csv: string, sites: Array<{ id: number; name: string }>, today: string) {
  const table = readCsvTable<WaitlistColumn>(csv, {
    columns: waitlistCsvColumns,
    required: ['name', 'email'],
    noun: 'waiting list',
    maxRows: MAX_MEMBER_IMPORT_ROWS,
    aliases: { ...emailAliases, telephone: 'phone', phone_number: 'phone', site: 'preferred_site', size: 'preferred_size' },
  });
  const errors = [...table.errors];
  const siteByName = new Map(sites.map((s) => [s.name.trim().toLowerCase(), s]));
  const rows: ParsedEntry[] = [];
  for (const r of table.rows) {
    const row = r.line;
    const name = unguard(r.get('name'));
    const emailText = r.get('email');
    if (table.unreadable) {
      rows.push({ row, name, email: emailText.toLowerCase(), entry: null });
      continue;
    }
    const bad = (field: WaitlistColumn | '', message: string) => errors.push({ row, field, message });
    const before = errors.length;
    const size = sizeWords.get(squash(r.get('preferred_size')));
    if (!size) bad('preferred_size', `Use one of: ${preferredSizes.join(', ')}`);
    const needsAccessible = readYesNo(r.get('needs_accessible'));
    if (needsAccessible === null) bad('needs_accessible', 'Use yes or no');
    const needsRaised = readYesNo(r.get('needs_raised'));
    if (needsRaised === null) bad('needs_raised', 'Use yes or no');
    const siteText = r.get('preferred_site');
    const site = siteText === '' ? null : (siteByName.get(siteText.toLowerCase()) ?? undefined);
    if (site === undefined) {
      bad(
        'preferred_site',
        sites.length === 0
          ? 'The club has no sites yet; leave this blank'
          : `No site is called "${siteText}"; use ${sites.map((s) => s.name).join(', ')} or leave it blank`,
      );
    }
    const dateText = r.get('applied_on');
    const appliedOn = dateText === '' ? null : readDate(dateText, today);
    if (appliedOn !== null && typeof appliedOn !== 'string') bad('applied_on', appliedOn.problem);
    if (emailText === '') bad('email', 'Enter an e-mail address');
    const input = {
      name,
      email: emailText,
      phone: unguard(r.get('phone')),
      notes: unguard(r.get('notes')),
    };
    const checked = ApplicationBodySchema.pick({ name: true, email: true, phone: true, notes: true }).safeParse(input);
    if (!checked.success) {
      const seen = new Set<string>(errors.slice(before).map((e) => e.field));
      for (const issue of checked.error.issues) {
        const field = columnOfKey[issue.path[0] as keyof ApplicationBody] ?? '';
        if (seen.has(field)) continue;
        seen.add(field);
        bad(field, issue.message);
      }
    }
    if (r.strays) bad('', 'This row has a value in a column without a name');
    const ok = errors.length === before && checked.success;
    rows.push({
      row,
      name,
      email: checked.success ? checked.data.email : emailText.toLowerCase(),
      entry: ok
        ? {
            name: checked.data.name,
            email: checked.data.email,
            phone: checked.data.phone,
            preferredSize: size!,
            needsAccessible: needsAccessible!,
            needsRaised: needsRaised!,
            preferredSiteId: site?.id ?? null,
            preferredSiteName: site?.name ?? null,
            appliedOn: appliedOn as string | null,
            notes: checked.data.notes,
          }
        : null,
    });
  }
  errors.push(...duplicateRows(rows));
  return { rows, errors };
}

async function liveWaitlistClashes(db: Db, clubId: number, rows: ParsedEntry[]): Promise<ImportProblem[]> {
  const emails = rows.map((r) => r.email).filter(Boolean);
  const live = new Set<string>();
  for (let i = 0; i < emails.length; i += 500) {
    const found: Array<{ email: string }> = await db('applications')
      .where({ club_id: clubId })
      .whereIn('status', ['waiting', 'offered'])
      .whereRaw('lower(email) = any(?)', [emails.slice(i, i + 500)])
      .select(db.raw('lower(email) as email'));
    for (const e of found) live.add(e.email);
  }
  return rows
    .filter((r) => live.has(r.email))
    .map((r) => ({ row: r.row, field: 'email', message: `${r.email} is already on this club's waiting list` }));
}

/**
 * Checks a waitlist CSV and, with commit, adds every row or none. applied_on keeps people's original
 * place: the queue orders by it, and rows with the same date (or none) keep the file's order.
 */
export async function importWaitlist(
  db: Knex,
  opts: { clubId: number; csv: string; commit: boolean; now?: Date },
): Promise<WaitlistImportResult> {
  const now = opts.now ?? new Date();
  const sites = await db('sites').where({ club_id: opts.clubId }).orderBy('name').select('id', 'name');
  const parsed = parseWaitlistCsv(opts.csv, sites, now.toISOString().slice(0, 10));
  const check = async (trx: Db) =>
    sortProblems([...parsed.errors, ...(await liveWaitlistClashes(trx, opts.clubId, parsed.rows))], waitlistCsvColumns);

  if (!opts.commit) {
    return { kind: 'waitlist', rows: parsed.rows, errors: await check(db), committed: false, counts: { imported: 0 } };
  }
  return db.transaction(async (trx) => {
    const errors = await check(trx);
    if (errors.length > 0) throw importRefusal(errors);
    const inserts = parsed.rows.map((r, i) => {
      const e = r.entry!;
      // Noon UTC is the same calendar day from UTC-11 to UTC+11; seconds keep the file's order within a day.
      const base = e.appliedOn ? Date.parse(`${e.appliedOn}T12:00:00Z`) + i * 1000 : now.getTime() + i;
      const at = new Date(base);
      return {
        club_id: opts.clubId,
        name: e.name,
        email: e.email,
        phone: e.phone,
        preferred_size: e.preferredSize,
        needs_accessible: e.needsAccessible,
        needs_raised: e.needsRaised,
        preferred_site_id: e.preferredSiteId,
        notes: e.notes,
        applied_at: at,
        queue_at: at,
      };
    });
    for (let i = 0; i < inserts.length; i += 500) await trx('applications').insert(inserts.slice(i, i + 500));
    return { kind: 'waitlist' as const, rows: parsed.rows, errors: [], committed: true, counts: { imported: inserts.length } };
  });
}

/** A starting waitlist file: the header and two example applications, oldest first. */
export function waitlistTemplateCsv(): string {
  return csvText(waitlistCsvColumns, [
    ['Nell Example', 'nell@example.org', '07700 900123', 'medium', 'no', 'no', '', '2024-02-11', 'Happy to share'],
    ['Omar Example', 'omar@example.org', '', 'small', 'yes', 'yes', '', '2025-01-06', 'Uses a wheelchair'],
  ]);
}
