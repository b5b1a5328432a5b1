import type { ClubChecklist } from '@shared/schemas/club-signups';
import type { Db } from '../db/knex';
import { notFound } from '../errors';

/**
 * The first-run steps, each done or not from the club's own rows (never a box someone ticks): a live site;
 * a live plot on one; a member besides the coordinators, or an invitation out; someone on the waiting list;
 * a saved fee schedule; a season. One query.
 */
export async function getClubChecklist(db: Db, clubId: number): Promise<ClubChecklist> {
  const row = await db('clubs as c')
    .where('c.id', clubId)
    .first(
      'c.checklist_hidden as hidden',
      db.raw('exists (select 1 from sites s where s.club_id = c.id and s.archived_at is null) as site'),
      db.raw(`exists (select 1 from plots p join sites s on s.id = p.site_id
        where s.club_id = c.id and s.archived_at is null and p.deleted_at is null) as plots`),
      db.raw(`(exists (select 1 from memberships m where m.club_id = c.id and m.role <> 'coordinator')
        or exists (select 1 from invites i where i.club_id = c.id)) as members`),
      db.raw('exists (select 1 from applications a where a.club_id = c.id) as waitlist'),
      db.raw('exists (select 1 from fee_schedules f where f.club_id = c.id) as fees'),
      db.raw('exists (select 1 from seasons n where n.club_id = c.id) as season'),
    );
  if (!row) throw notFound('The club');
  const steps = (['site', 'plots', 'members', 'waitlist', 'fees', 'season'] as const).map((key) => ({ key, done: Boolean(row[key]) }));
  return { hidden: Boolean(row.hidden), steps };
}

/** Hides the checklist from the coordinators' home, or brings it back (from the club's settings). */
export async function setChecklistHidden(db: Db, clubId: number, hidden: boolean): Promise<ClubChecklist> {
  await db('clubs').where({ id: clubId }).update({ checklist_hidden: hidden });
  return getClubChecklist(db, clubId);
}
