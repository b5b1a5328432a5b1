import type { Knex } from 'knex';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Mailer } from '../mail/mailer';
import { sendDueMail } from '../services/outbox';
import { pruneIdempotencyKeys } from '../middleware/idempotency';
import { sweepDeadlines } from './deadlines';
import { queueNightlyTaskRuns, runQueuedTaskRuns } from '../services/task-runs';
import { markMissedShifts, sendShiftDigests, sendShiftReminders } from '../services/shift-claims';

export const DEADLINE_QUEUE = 'deadline-sweep';
export const MAIL_QUEUE = 'mail-send';
export const TASK_RUN_QUEUE = 'task-runs';
export const NIGHTLY_TASKS_QUEUE = 'tasks-nightly';
export const SHIFT_QUEUE = 'shift-mail';

export interface Jobs {
  stop(): Promise<void>;
}

/** Our advisory lock key (two-key form) for creating the job queues; the second key is 1. */
const QUEUE_CREATION_LOCK = 7_401;

/**
 * Starts pg-boss and creates the queues that do not exist yet, one server at a time: pg-boss 10's
 * createQueue (ours, and its own cron queue made in start()) inserts the queue row and creates its
 * partition table with no lock of its own, and two servers starting together on a new database
 * deadlocked there (PostgreSQL 40P01), which stopped one of them. Our advisory lock, held in a knex
 * transaction while pg-boss's own pool does the work, makes the second wait and then find the queues made.
 */
async function startAndCreateQueues(db: Knex, boss: PgBoss, names: string[]): Promise<void> {
  await db.transaction(async (trx) => {
    await trx.raw('select pg_advisory_xact_lock(?, 1)', [QUEUE_CREATION_LOCK]);
    await boss.start();
    const existing = new Set((await boss.getQueues()).map((q) => q.name));
    for (const name of names) if (!existing.has(name)) await boss.createQueue(name);
  });
}

/**
 * Starts the Postgres-backed job queue (pg-boss): a sweep of offer and renewal deadlines every
 * minute, plus one at start-up so nothing due while the server was down waits longer. The
 * schedule lives in the database, so several servers side by side run it once a minute. The same
 * goes for the mail sender: every minute it sends what is due in the outbox (retries included);
 * mail written by a request is also sent straight after its commit (`kickMail`).
 */
export async function startJobs(
  databaseUrl: string,
  db: Knex,
  mailer: Mailer,
  log: Pick<Logger, 'info' | 'error'>,
  opts: { publicUrl?: string } = {},
): Promise<Jobs> {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 3 });
  boss.on('error', (err) => log.error({ err }, 'job queue error'));
  await startAndCreateQueues(db, boss, [DEADLINE_QUEUE, MAIL_QUEUE, NIGHTLY_TASKS_QUEUE, TASK_RUN_QUEUE, SHIFT_QUEUE]);
  await boss.schedule(DEADLINE_QUEUE, '* * * * *');
  await boss.work(DEADLINE_QUEUE, async () => {
    const done = await sweepDeadlines(db, new Date());
    await pruneIdempotencyKeys(db, new Date());
    if (done.offersLapsed || done.renewalsLapsed) log.info(done, 'deadlines swept');
  });
  await boss.send(DEADLINE_QUEUE, {});
  // pg-boss 10: a queue must exist before schedule/work (made above), and work() hands over an array of jobs.
  await boss.schedule(MAIL_QUEUE, '* * * * *');
  await boss.work(MAIL_QUEUE, async () => {
    const done = await sendDueMail(db, mailer, new Date());
    if (done.sent || done.retrying || done.failed) log.info(done, 'outbox mail sent');
  });
  await boss.send(MAIL_QUEUE, {});
  // The season's tasks: every night a run per live site; every minute any run still queued (a
  // coordinator's run starts at once in the process that queued it, this is the safety net).
  await boss.schedule(NIGHTLY_TASKS_QUEUE, '30 2 * * *');
  await boss.work(NIGHTLY_TASKS_QUEUE, async () => {
    const sites = await queueNightlyTaskRuns(db);
    const runs = await runQueuedTaskRuns(db);
    log.info({ sites, runs }, 'nightly task runs');
  });
  // A server that was down over night (or a first start) plans today's tasks now, not tomorrow night.
  const recent = await db('task_runs').where('created_at', '>', db.raw("now() - interval '20 hours'")).first('id');
  if (!recent) await boss.send(NIGHTLY_TASKS_QUEUE, {});
  await boss.schedule(TASK_RUN_QUEUE, '* * * * *');
  await boss.work(TASK_RUN_QUEUE, async () => {
    const runs = await runQueuedTaskRuns(db);
    if (runs) log.info({ runs }, 'task runs');
  });
  // Shifts, every five minutes: places of ended shifts not marked done become missed, reminders go
  // from a day before, and each volunteer's weekly e-mail of open shifts on their day (once a week:
  // the shift_digests row is the proof, whichever server gets there first).
  const publicUrl = opts.publicUrl ?? 'http://127.0.0.1:3000';
  await boss.schedule(SHIFT_QUEUE, '*/5 * * * *');
  await boss.work(SHIFT_QUEUE, async () => {
    const now = new Date();
    const missed = await markMissedShifts(db, { now });
    const reminders = await sendShiftReminders(db, mailer, { publicUrl, now });
    const digests = await sendShiftDigests(db, mailer, { publicUrl, now });
    if (missed || reminders || digests) log.info({ missed, reminders, digests }, 'shift mail');
  });
  return {
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
    },
  };
}
