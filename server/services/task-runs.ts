import type { Knex } from 'knex';
import type { TaskRun } from '@shared/schemas/tasks';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import { generateSiteTasks } from './tasks';

// Runs of the task generator over a whole site: queued by a coordinator or by the nightly schedule,
// claimed by exactly one server (FOR UPDATE SKIP LOCKED), and reporting progress as they go.

interface RunRow {
  id: number;
  club_id: number;
  site_id: number;
  status: TaskRun['status'];
  total: number;
  done: number;
  created: number;
  updated: number;
  removed: number;
  error: string | null;
}

export const toTaskRun = (r: RunRow): TaskRun => ({
  id: r.id,
  siteId: r.site_id,
  status: r.status,
  total: r.total,
  done: r.done,
  created: r.created,
  updated: r.updated,
  removed: r.removed,
  error: r.error,
});

/** Queues a run for a site, or answers the one already waiting or running there. */
export async function queueTaskRun(db: Knex, opts: { clubId: number; siteId: number; userId: number | null }): Promise<TaskRun> {
  return db.transaction(async (trx) => {
    await trx.raw('select pg_advisory_xact_lock(7302, ?)', [opts.siteId]);
    const waiting: RunRow | undefined = await trx('task_runs').where({ site_id: opts.siteId }).whereIn('status', ['queued', 'running']).orderBy('id').first();
    if (waiting) return toTaskRun(waiting);
    const [row] = await trx('task_runs').insert({ club_id: opts.clubId, site_id: opts.siteId, requested_by_user_id: opts.userId }).returning('*');
    return toTaskRun(row);
  });
}

/** A run, to a coordinator of its club: another member of the club 403, anyone else (or no such run) 404. */
export async function taskRunFor(db: Db, opts: { runId: number; userId: number }): Promise<TaskRun> {
  const row: RunRow | undefined = await db('task_runs').where({ id: opts.runId }).first();
  const roles: string[] = row ? await db('memberships').where({ club_id: row.club_id, user_id: opts.userId }).pluck('role') : [];
  if (!row || roles.length === 0) throw notFound('The run');
  if (!roles.includes('coordinator')) throw new AppError('forbidden', 'Only the club’s coordinators can follow a task run.');
  return toTaskRun(row);
}

/** Claims the oldest queued run (one server gets it) and carries it out. Returns false when none was waiting. */
export async function runNextTaskRun(db: Knex, now: Date = new Date()): Promise<boolean> {
  const claimed: RunRow | undefined = (
    await db.raw(
      `update task_runs set status = 'running'
        where id = (select id from task_runs where status = 'queued' order by id for update skip locked limit 1)
        returning *`,
    )
  ).rows[0];
  if (!claimed) return false;
  try {
    const totals = await generateSiteTasks(db, claimed.site_id, {
      now,
      onProgress: (p) => db('task_runs').where({ id: claimed.id }).update({ total: p.total, done: p.done, created: p.created, updated: p.updated, removed: p.removed }),
    });
    await db('task_runs').where({ id: claimed.id }).update({ status: 'done', total: totals.total, done: totals.total, created: totals.created, updated: totals.updated, removed: totals.removed, finished_at: db.fn.now() });
  } catch (err) {
    await db('task_runs')
      .where({ id: claimed.id })
      .update({ status: 'failed', error: err instanceof Error ? err.message.slice(0, 500) : 'The run stopped', finished_at: db.fn.now() });
  }
  return true;
}

/** Carries out every queued run. */
export async function runQueuedTaskRuns(db: Knex, now?: Date): Promise<number> {
  let n = 0;
  while (await runNextTaskRun(db, now)) n++;
  return n;
}

/** The nightly schedule: one run for every live site of every club that has a season. */
export async function queueNightlyTaskRuns(db: Knex): Promise<number> {
  const sites: Array<{ id: number; club_id: number }> = await db('sites as s')
    .whereNull('s.archived_at')
    .whereExists(db('seasons as se').whereRaw('se.club_id = s.club_id'))
    .select('s.id', 's.club_id');
  for (const s of sites) await queueTaskRun(db, { clubId: s.club_id, siteId: s.id, userId: null });
  return sites.length;
}

const kicks = new WeakMap<Knex, Promise<void>>();

/** Starts the queued runs in this process straight away (the minute job picks up anything left). */
export function kickTaskRuns(db: Knex): void {
  if (kicks.has(db)) {
    void kicks.get(db)!.then(() => kickTaskRuns(db));
    return;
  }
  const p = runQueuedTaskRuns(db)
    .then(() => undefined)
    .catch((err) => console.warn('task runs stopped:', err instanceof Error ? err.message : err))
    .finally(() => kicks.delete(db));
  kicks.set(db, p);
}

/** Waits for the runs this process started (a server stops after them). */
export async function taskRunsIdle(db: Knex): Promise<void> {
  while (kicks.has(db)) await kicks.get(db);
}
