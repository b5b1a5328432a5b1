import { TZDate } from '@date-fns/tz';
import type { Knex } from 'knex';
import { addCalendarDays, localToday } from '@shared/dates';
import type { Role } from '@shared/schemas/auth';
import type { ClaimStatus, Shift, ShiftCreateBody, ShiftDetail, ShiftKind, ShiftQuery, ShiftUpdateBody } from '@shared/schemas/shifts';
import { shiftCaution, shiftState, suggestShifts } from '@shared/shifts';
import type { TaskKind } from '@shared/schemas/tasks';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import { taskRows, toTaskView, type TaskRow } from './task-views';
import type { ClubLookup } from './memberships';

// Shifts for the board and their coordinators: the board for a range, one shift with its tasks, the
// groupings suggested from open tasks, and making, changing and calling off shifts. Who took places
// is for coordinators' eyes; everyone else sees how many places are taken and their own.

export interface Viewer {
  userId: number;
  roles: Role[];
}

export interface ShiftRow {
  id: number;
  club_id: number;
  site_id: number;
  site_name: string;
  time_zone: string;
  units: 'metric' | 'us';
  title: string;
  kind: ShiftKind;
  on_date: string;
  start_time: string;
  end_time: string;
  starts_at: Date;
  ends_at: Date;
  capacity: number;
  est_hours: string;
  instructions: string;
  called_off_at: Date | null;
  version: number;
}

interface ClaimRow {
  id: number;
  shift_id: number;
  user_id: number;
  name: string;
  status: ClaimStatus;
  hours: string | null;
  note: string;
  photo_path: string | null;
}

/** The club a shift belongs to (for the role checks of /api/shifts/:shiftId). */
export const clubOfShift: ClubLookup = (db, shiftId) => db('shifts').where({ id: shiftId }).select('club_id');

export const shiftRows = (db: Db) =>
  db('shifts as sh')
    .join('sites as s', 's.id', 'sh.site_id')
    .select('sh.*', 's.name as site_name', 's.time_zone', 's.units');

/** The instant a wall-clock time on a calendar date is in a zone (a time in a spring-forward gap moves on). */
export function siteInstant(date: string, time: string, timeZone: string): Date {
  const [y, m, d] = date.split('-').map(Number);
  const [hh, mm] = time.split(':').map(Number);
  return new Date(new TZDate(y, m - 1, d, hh, mm, timeZone).getTime());
}

/**
 * Shift rows as the API answers them, in three queries whatever their number: the rows (given),
 * their places, and a summary of their tasks.
 */
export async function toShiftViews(db: Db, rows: ShiftRow[], viewer: Viewer | null, now: Date = new Date()): Promise<Shift[]> {
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const [claims, tasks] = await Promise.all([
    db('shift_claims as c').join('users as u', 'u.id', 'c.user_id').whereIn('c.shift_id', ids).orderBy('c.id').select('c.id', 'c.shift_id', 'c.user_id', 'u.name', 'c.status', 'c.hours', 'c.note', 'c.photo_path') as Promise<ClaimRow[]>,
    db('shift_tasks as st')
      .join('tasks as t', 't.id', 'st.task_id')
      .leftJoin('plots as p', 'p.id', 't.plot_id')
      .whereIn('st.shift_id', ids)
      .groupBy('st.shift_id')
      .select(
        'st.shift_id',
        db.raw('count(*)::int as n'),
        db.raw("coalesce(array_agg(distinct p.label) filter (where p.label is not null), '{}') as labels"),
        db.raw("sum(t.amount_l) filter (where t.kind = 'water') as litres"),
        db.raw('array_agg(distinct t.kind) as kinds'),
      ) as Promise<Array<{ shift_id: number; n: number; labels: string[]; litres: string | null; kinds: TaskKind[] }>>,
  ]);
  const claimsOf = new Map<number, ClaimRow[]>();
  for (const c of claims) {
    const list = claimsOf.get(c.shift_id);
    if (list) list.push(c);
    else claimsOf.set(c.shift_id, [c]);
  }
  const tasksOf = new Map(tasks.map((t) => [t.shift_id, t]));
  const seesPeople = viewer?.roles.includes('coordinator') ?? false;
  const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });
  return rows.map((r) => {
    const cs = claimsOf.get(r.id) ?? [];
    const ts = tasksOf.get(r.id);
    const mine = viewer ? [...cs].reverse().find((c) => c.user_id === viewer.userId) : undefined;
    return {
      id: r.id,
      siteId: r.site_id,
      siteName: r.site_name,
      timeZone: r.time_zone,
      units: r.units,
      title: r.title,
      kind: r.kind,
      date: r.on_date,
      startTime: r.start_time,
      endTime: r.end_time,
      startsAt: new Date(r.starts_at).toISOString(),
      endsAt: new Date(r.ends_at).toISOString(),
      capacity: r.capacity,
      taken: cs.filter((c) => c.status === 'taken' || c.status === 'done').length,
      estHours: Number(r.est_hours),
      instructions: r.instructions,
      caution: shiftCaution([r.kind, ...(ts?.kinds ?? [])]),
      state: shiftState({ calledOff: r.called_off_at !== null, endsAt: new Date(r.ends_at), capacity: r.capacity }, cs, now),
      taskCount: ts?.n ?? 0,
      plotLabels: [...(ts?.labels ?? [])].sort(collator.compare),
      amountL: ts?.litres == null ? null : Math.round(Number(ts.litres) * 10) / 10,
      myClaim: mine ? { id: mine.id, status: mine.status } : null,
      people: seesPeople
        ? cs.map((c) => ({ claimId: c.id, userId: c.user_id, name: c.name, status: c.status, hours: c.hours === null ? null : Number(c.hours), note: c.note, hasPhoto: c.photo_path !== null }))
        : null,
      version: r.version,
    };
  });
}

/** The club's zone decides "today" for a board that spans its sites. */
async function clubZone(db: Db, clubId: number): Promise<string> {
  return (await db('clubs').where({ id: clubId }).first('time_zone'))?.time_zone ?? 'UTC';
}

/** The board: a club's shifts for a range of dates (default this week and the next three), by date and time. */
export async function listShifts(db: Db, opts: { clubId: number; viewer: Viewer; query: ShiftQuery; now?: Date }) {
  const now = opts.now ?? new Date();
  const today = localToday(await clubZone(db, opts.clubId), now);
  const from = opts.query.from ?? today;
  const to = opts.query.to ?? addCalendarDays(from, 27);
  if (addCalendarDays(from, 92) < to) throw new AppError('validation_failed', 'At most 92 days at a time.', { to: 'At most 92 days at a time' });
  let q = shiftRows(db).where('sh.club_id', opts.clubId).whereBetween('sh.on_date', [from, to]).whereNull('s.archived_at');
  if (opts.query.siteId) q = q.where('sh.site_id', opts.query.siteId);
  if (opts.query.kind) q = q.where('sh.kind', opts.query.kind);
  const rows: ShiftRow[] = await q.orderBy([{ column: 'sh.on_date' }, { column: 'sh.start_time' }, { column: 'sh.id' }]).limit(1000);
  let items = await toShiftViews(db, rows, opts.viewer, now);
  if (opts.query.open === 'true') items = items.filter((s) => s.state === 'needs_people');
  return { items, from, to };
}

export async function shiftDetail(db: Db, opts: { shiftId: number; viewer: Viewer | null; now?: Date }): Promise<ShiftDetail> {
  const row: ShiftRow | undefined = await shiftRows(db).where('sh.id', opts.shiftId).first();
  if (!row) throw notFound('The shift');
  const [view] = await toShiftViews(db, [row], opts.viewer, opts.now);
  const tasks: TaskRow[] = await taskRows(db)
    .join('shift_tasks as st', 'st.task_id', 't.id')
    .where('st.shift_id', opts.shiftId)
    .orderBy([{ column: 'p.label' }, { column: 't.id' }]);
  return { ...view, tasks: tasks.map(toTaskView) };
}

/** Open tasks that volunteers may do (coordinators' tasks and those a holder handed over), in no shift yet. */
function openVolunteerTasks(db: Db, clubId: number) {
  return db('tasks as t')
    .leftJoin('plots as p', 'p.id', 't.plot_id')
    .leftJoin('shift_tasks as st', 'st.task_id', 't.id')
    .where({ 't.club_id': clubId, 't.status': 'open' })
    .whereNull('st.task_id')
    .where((w) => w.where('t.origin', 'coordinator').orWhere('t.for_volunteers', true));
}

/** Groupings of the open tasks in a range into shifts, for the coordinator to edit and make. */
export async function shiftSuggestions(db: Db, opts: { clubId: number; siteId?: number; from?: string; to?: string; now?: Date }) {
  const today = localToday(await clubZone(db, opts.clubId), opts.now);
  const from = opts.from && opts.from > today ? opts.from : today;
  const to = opts.to ?? addCalendarDays(from, 13);
  let q = openVolunteerTasks(db, opts.clubId).whereBetween('t.due_on', [from, to]);
  if (opts.siteId) q = q.where('t.site_id', opts.siteId);
  const tasks = await q.select('t.id', 't.site_id', 't.kind', 't.due_on', 'p.label', 't.amount_l').limit(5000);
  const sites = await db('sites').where({ club_id: opts.clubId }).select('id', 'name', 'units');
  const siteById = new Map(sites.map((s: { id: number; name: string; units: 'metric' | 'us' }) => [s.id, s]));
  const items = suggestShifts(
    tasks.map((t: { id: string | number; site_id: number; kind: TaskKind; due_on: string; label: string | null; amount_l: string | null }) => ({
      id: Number(t.id),
      siteId: t.site_id,
      kind: t.kind,
      dueOn: t.due_on,
      plotLabel: t.label,
      amountL: t.amount_l === null ? null : Number(t.amount_l),
    })),
    { units: (id) => siteById.get(id)?.units ?? 'metric' },
  ).map((s) => ({ ...s, siteName: siteById.get(s.siteId)?.name ?? '' }));
  return { items, from, to };
}

async function assertShiftTasks(trx: Knex.Transaction, opts: { clubId: number; siteId: number; taskIds: number[]; shiftId: number | null }) {
  if (!opts.taskIds.length) return;
  const ids = [...new Set(opts.taskIds)];
  const found = await trx('tasks as t')
    .leftJoin('shift_tasks as st', 'st.task_id', 't.id')
    .whereIn('t.id', ids)
    .forUpdate('t')
    .select('t.id', 't.site_id', 't.club_id', 't.status', 't.origin', 't.for_volunteers', 'st.shift_id');
  const byId = new Map(found.map((t: { id: string | number }) => [Number(t.id), t]));
  for (const id of ids) {
    const t = byId.get(id) as { site_id: number; club_id: number; status: string; origin: string; for_volunteers: boolean; shift_id: number | null } | undefined;
    if (!t || t.club_id !== opts.clubId || t.site_id !== opts.siteId) {
      throw new AppError('validation_failed', 'A task is not one of this site’s.', { taskIds: `Task ${id} is not an open task of this site` });
    }
    if (t.status !== 'open') throw new AppError('conflict', `Task ${id} is no longer open.`, { taskIds: `Task ${id} is already done or not needed` });
    if (t.origin !== 'coordinator' && !t.for_volunteers) {
      throw new AppError('validation_failed', 'That task is its plot holder’s.', { taskIds: `Task ${id} is the plot holder’s own; only handed-over tasks go to volunteers` });
    }
    if (t.shift_id !== null && t.shift_id !== opts.shiftId) throw new AppError('conflict', `Task ${id} is already in another shift.`, { taskIds: `Task ${id} is in another shift` });
  }
}

function assertNotPast(date: string, startTime: string, timeZone: string, now: Date) {
  const today = localToday(timeZone, now);
  if (date < today) throw new AppError('validation_failed', 'That date has passed.', { date: `On or after ${today}` });
  if (date > addCalendarDays(today, 366)) throw new AppError('validation_failed', 'That is more than a year ahead.', { date: 'Within a year from today' });
  if (siteInstant(date, startTime, timeZone) <= now) throw new AppError('validation_failed', 'That time has passed.', { startTime: 'A time still to come' });
}

export async function createShift(db: Knex, opts: { clubId: number; userId: number; viewer: Viewer; body: ShiftCreateBody; now?: Date }): Promise<ShiftDetail> {
  const now = opts.now ?? new Date();
  const b = opts.body;
  const id = await db.transaction(async (trx) => {
    const site = await trx('sites').where({ id: b.siteId, club_id: opts.clubId }).whereNull('archived_at').first('id', 'time_zone');
    if (!site) throw new AppError('validation_failed', 'That site is not one of this club’s.', { siteId: 'Choose a site of this club' });
    assertNotPast(b.date, b.startTime, site.time_zone, now);
    await assertShiftTasks(trx, { clubId: opts.clubId, siteId: b.siteId, taskIds: b.taskIds, shiftId: null });
    const [row] = await trx('shifts')
      .insert({
        club_id: opts.clubId,
        site_id: b.siteId,
        title: b.title,
        kind: b.kind,
        on_date: b.date,
        start_time: b.startTime,
        end_time: b.endTime,
        starts_at: siteInstant(b.date, b.startTime, site.time_zone),
        ends_at: siteInstant(b.date, b.endTime, site.time_zone),
        capacity: b.capacity,
        est_hours: b.estHours,
        instructions: b.instructions,
        created_by_user_id: opts.userId,
      })
      .returning('id');
    const taskIds = [...new Set(b.taskIds)];
    if (taskIds.length) await trx('shift_tasks').insert(taskIds.map((task_id) => ({ shift_id: row.id, task_id })));
    return row.id as number;
  });
  return shiftDetail(db, { shiftId: id, viewer: opts.viewer, now });
}

export async function updateShift(db: Knex, opts: { shiftId: number; viewer: Viewer; body: ShiftUpdateBody; now?: Date }): Promise<ShiftDetail> {
  const now = opts.now ?? new Date();
  const { version, taskIds, ...b } = opts.body;
  await db.transaction(async (trx) => {
    const row: ShiftRow | undefined = await trx('shifts as sh').join('sites as s', 's.id', 'sh.site_id').where('sh.id', opts.shiftId).forUpdate('sh').first('sh.*', 's.time_zone');
    if (!row) throw notFound('The shift');
    if (row.version !== version) throw new AppError('conflict', 'Someone changed this shift since you opened it. It has been reloaded; make your change again.');
    if (row.called_off_at) throw new AppError('conflict', 'This shift was called off and cannot be changed.');
    const date = b.date ?? row.on_date;
    const startTime = b.startTime ?? row.start_time;
    const endTime = b.endTime ?? row.end_time;
    if (endTime <= startTime) throw new AppError('validation_failed', 'The end is before the start.', { endTime: 'After the start' });
    const moves = b.date !== undefined || b.startTime !== undefined || b.endTime !== undefined;
    if (moves) assertNotPast(date, startTime, row.time_zone, now);
    if (b.capacity !== undefined) {
      const [{ n }] = await trx('shift_claims').where({ shift_id: row.id, status: 'taken' }).count({ n: '*' });
      if (Number(n) > b.capacity) {
        throw new AppError('conflict', `${n} people hold places, more than ${b.capacity}.`, { capacity: `At least ${n}: that many people hold places` });
      }
    }
    if (taskIds) {
      await assertShiftTasks(trx, { clubId: row.club_id, siteId: row.site_id, taskIds, shiftId: row.id });
      await trx('shift_tasks').where({ shift_id: row.id }).delete();
      const unique = [...new Set(taskIds)];
      if (unique.length) await trx('shift_tasks').insert(unique.map((task_id) => ({ shift_id: row.id, task_id })));
    }
    await trx('shifts')
      .where({ id: row.id })
      .update({
        ...(b.title !== undefined ? { title: b.title } : {}),
        ...(b.kind !== undefined ? { kind: b.kind } : {}),
        ...(b.capacity !== undefined ? { capacity: b.capacity } : {}),
        ...(b.estHours !== undefined ? { est_hours: b.estHours } : {}),
        ...(b.instructions !== undefined ? { instructions: b.instructions } : {}),
        on_date: date,
        start_time: startTime,
        end_time: endTime,
        starts_at: siteInstant(date, startTime, row.time_zone),
        ends_at: siteInstant(date, endTime, row.time_zone),
        version: row.version + 1,
        updated_at: trx.fn.now(),
      });
    // Links already e-mailed for this shift last until it starts: a moved shift moves them too.
    if (moves) {
      await trx('shift_links').where({ shift_id: row.id }).whereIn('purpose', ['claim', 'release']).update({ expires_at: siteInstant(date, startTime, row.time_zone) });
    }
  });
  return shiftDetail(db, { shiftId: opts.shiftId, viewer: opts.viewer, now });
}
