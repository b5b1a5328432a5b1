import type { Knex } from 'knex';
import { localToday } from '@shared/dates';
import type { HoursRow, HoursTable, MyShifts, VolunteerSettings } from '@shared/schemas/shifts';
import type { Db } from '../db/knex';
import { SHIFT_REMINDER } from './mail-stops';
import { shiftRows, toShiftViews, type ShiftRow, type Viewer } from './shifts';

// Hours per person per season (the year of the shift's date at its site): only places marked done
// count, at the hours the person gave (the shift's estimate unless they said otherwise), against the
// hours the club asks of each volunteer.

async function clubAsk(db: Db, clubId: number): Promise<{ required: number | null; zone: string }> {
  const row = await db('clubs').where({ id: clubId }).first('volunteer_hours_required', 'time_zone');
  return { required: row?.volunteer_hours_required == null ? null : Number(row.volunteer_hours_required), zone: row?.time_zone ?? 'UTC' };
}

const rowOf = (r: { id: number; name: string; shifts_done: number | string | null; hours: number | string | null }, required: number | null): HoursRow => {
  const hours = Math.round(Number(r.hours ?? 0) * 100) / 100;
  return {
    userId: r.id,
    name: r.name,
    shiftsDone: Number(r.shifts_done ?? 0),
    hours,
    required,
    remaining: required === null ? null : Math.max(0, Math.round((required - hours) * 100) / 100),
  };
};

function doneHours(db: Db, clubId: number, year: number) {
  return db('shift_claims as c')
    .join('shifts as sh', 'sh.id', 'c.shift_id')
    .where({ 'sh.club_id': clubId, 'c.status': 'done' })
    .whereRaw('extract(year from sh.on_date) = ?', [year])
    .groupBy('c.user_id')
    .select('c.user_id', db.raw('count(*)::int as shifts_done'), db.raw('sum(c.hours) as hours'));
}

/** Every volunteer of the club and anyone else with done places that season, most hours first. */
export async function hoursTable(db: Db, opts: { clubId: number; year?: number; now?: Date }): Promise<HoursTable> {
  const ask = await clubAsk(db, opts.clubId);
  const year = opts.year ?? Number(localToday(ask.zone, opts.now).slice(0, 4));
  const rows = await db('users as u')
    .leftJoin(doneHours(db, opts.clubId, year).as('h'), 'h.user_id', 'u.id')
    .where((w) =>
      w
        .whereIn('u.id', db('memberships').where({ club_id: opts.clubId, role: 'volunteer' }).select('user_id'))
        .orWhereNotNull('h.user_id'),
    )
    .orderBy([{ column: 'hours', order: 'desc', nulls: 'last' }, { column: 'u.name' }])
    .select('u.id', 'u.name', 'h.shifts_done', 'h.hours');
  return { year, required: ask.required, items: rows.map((r: Parameters<typeof rowOf>[0]) => rowOf(r, ask.required)) };
}

export const HOURS_CSV_FIELDS = ['Name', 'Season', 'Shifts done', 'Hours', 'Hours asked', 'Hours still to do'] as const;

export function hoursCsvRows(table: HoursTable): Array<Array<string | number>> {
  return table.items.map((r) => [r.name, table.year, r.shiftsDone, r.hours, r.required ?? '', r.remaining ?? '']);
}

/** A person's own shifts: upcoming places, the last done or missed, and their hours this season. */
export async function myShifts(db: Db, opts: { clubId: number; viewer: Viewer; now?: Date }): Promise<MyShifts> {
  const now = opts.now ?? new Date();
  const ask = await clubAsk(db, opts.clubId);
  const year = Number(localToday(ask.zone, now).slice(0, 4));
  const mine = db('shift_claims').where({ user_id: opts.viewer.userId }).whereNot('status', 'released').select('shift_id');
  const [upcoming, past, hours, me] = await Promise.all([
    shiftRows(db).where('sh.club_id', opts.clubId).whereIn('sh.id', mine).where('sh.ends_at', '>', now).orderBy('sh.starts_at').limit(100) as Promise<ShiftRow[]>,
    shiftRows(db).where('sh.club_id', opts.clubId).whereIn('sh.id', mine).where('sh.ends_at', '<=', now).orderBy('sh.starts_at', 'desc').limit(50) as Promise<ShiftRow[]>,
    doneHours(db, opts.clubId, year).where('c.user_id', opts.viewer.userId).first(),
    db('users').where({ id: opts.viewer.userId }).first('id', 'name'),
  ]);
  const views = await toShiftViews(db, [...upcoming, ...past], opts.viewer, now);
  return {
    upcoming: views.slice(0, upcoming.length),
    past: views.slice(upcoming.length),
    hours: rowOf({ id: me.id, name: me.name, shifts_done: hours?.shifts_done ?? 0, hours: hours?.hours ?? 0 }, ask.required),
    year,
  };
}

export async function getVolunteerSettings(db: Db, opts: { clubId: number; userId: number }): Promise<VolunteerSettings> {
  const row = await db('volunteer_settings').where({ club_id: opts.clubId, user_id: opts.userId }).first('digest_day', 'help_mail');
  const reminder = await db('mail_preferences').where({ club_id: opts.clubId, user_id: opts.userId, topic: SHIFT_REMINDER }).first('is_subscribed');
  const reminders = reminder ? Boolean(reminder.is_subscribed) : true;
  // Until a person chooses, the weekly e-mail comes on Mondays, and calls for help and reminders come too.
  return row ? { digestDay: row.digest_day, helpMail: row.help_mail, reminders } : { digestDay: 1, helpMail: true, reminders };
}

export async function setVolunteerSettings(db: Knex, opts: { clubId: number; userId: number; body: Partial<VolunteerSettings> }): Promise<VolunteerSettings> {
  const current = await getVolunteerSettings(db, opts);
  const next = { ...current, ...opts.body };
  await db('volunteer_settings')
    .insert({ club_id: opts.clubId, user_id: opts.userId, digest_day: next.digestDay, help_mail: next.helpMail })
    .onConflict(['club_id', 'user_id'])
    .merge({ digest_day: next.digestDay, help_mail: next.helpMail, updated_at: db.fn.now() });
  if (opts.body.reminders !== undefined) {
    await db('mail_preferences')
      .insert({ club_id: opts.clubId, user_id: opts.userId, topic: SHIFT_REMINDER, is_subscribed: next.reminders })
      .onConflict(['user_id', 'club_id', 'topic'])
      .merge({ is_subscribed: next.reminders, updated_at: db.fn.now() });
  }
  return getVolunteerSettings(db, opts);
}
