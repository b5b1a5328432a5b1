import { allocationCsvColumns, memberCsvColumns, waitlistCsvColumns } from '@shared/schemas/member-imports';
import type { Db } from '../db/knex';
import { csvText } from './csv-files';

const yesNo = (v: boolean) => (v ? 'yes' : 'no');

/** The club's members in the members import's columns (roles joined with ;), by name, so the file imports back. */
export async function membersCsv(db: Db, clubId: number): Promise<string> {
  const rows = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.club_id', clubId)
    .groupBy('u.id')
    .orderBy('u.name')
    .orderBy('u.id')
    .select('u.name', 'u.email', db.raw("string_agg(m.role, ';' order by m.role) as roles"));
  return csvText(
    memberCsvColumns.filter((c) => c !== 'send_invite'),
    rows.map((r) => [r.name, r.email, r.roles]),
  );
}

/** The live waiting list (waiting and offered) in queue order, in the waiting list import's columns. */
export async function waitlistCsv(db: Db, clubId: number): Promise<string> {
  const rows = await db('applications as a')
    .leftJoin('sites as s', 's.id', 'a.preferred_site_id')
    .where('a.club_id', clubId)
    .whereIn('a.status', ['waiting', 'offered'])
    .orderBy('a.queue_at')
    .orderBy('a.id')
    .select('a.*', 's.name as site_name');
  return csvText(
    waitlistCsvColumns,
    rows.map((r) => [
      r.name,
      r.email,
      r.phone,
      r.preferred_size,
      yesNo(r.needs_accessible),
      yesNo(r.needs_raised),
      r.site_name ?? '',
      (r.applied_at as Date).toISOString().slice(0, 10),
      r.notes,
    ]),
  );
}

/** Who held which plot, by season (all seasons, or one year), site and plot label. */
export async function allocationsCsv(db: Db, clubId: number, year?: number): Promise<string> {
  const q = db('allocations as a')
    .join('seasons as se', 'se.id', 'a.season_id')
    .join('plots as p', 'p.id', 'a.plot_id')
    .join('sites as s', 's.id', 'p.site_id')
    .join('users as u', 'u.id', 'a.user_id')
    .where('se.club_id', clubId)
    .orderBy('se.year')
    .orderBy('s.name')
    .orderByRaw('lower(p.label)')
    .orderBy('a.id')
    .select('se.year', 's.name as site', 'p.label as plot', 'u.name as holder_name', 'u.email as holder_email', 'a.status');
  if (year !== undefined) q.where('se.year', year);
  const rows = await q;
  return csvText(
    allocationCsvColumns,
    rows.map((r) => [r.year, r.site, r.plot, r.holder_name, r.holder_email, r.status]),
  );
}
