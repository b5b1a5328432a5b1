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
  await boss.start();
  await boss.createQueue(DEADLINE_QUEUE);
  await boss.schedule(DEADLINE_QUEUE, '* * * * *');
  await boss.work(DEADLINE_QUEUE, async () => {
    const done = await sweepDeadlines(db, new Date());
    await pruneIdempotencyKeys(db, new Date());
    if (done.offersLapsed || done.renewalsLapsed) log.info(done, 'deadlines swept');
  });
  await boss.send(DEADLINE_QUEUE, {});
  // pg-boss 10: a queue must exist before schedule/work, and work() hands over an array of jobs.
  await boss.createQueue(MAIL_QUEUE);
  await boss.schedule(MAIL_QUEUE, '* * * * *');
  await boss.work(MAIL_QUEUE, async () => {
    const done = await sendDueMail(db, mailer, new Date());
    if (done.sent || done.retrying || done.failed) log.info(done, 'outbox mail sent');
  });
  await boss.send(MAIL_QUEUE, {});
  // The season's tasks: every night a run per live site; every minute any run still queued (a
  // coordinator's run starts at once in the process that queued it, this is the safety net).
  await boss.createQueue(NIGHTLY_TASKS_QUEUE);
  await boss.schedule(NIGHTLY_TASKS_QUEUE, '30 2 * * *');
  await boss.work(NIGHTLY_TASKS_QUEUE, async () => {
    const sites = await queueNightlyTaskRuns(db);
    const runs = await runQueuedTaskRuns(db);
    log.info({ sites, runs }, 'nightly task runs');
  });
  // A server that was down over night (or a first start) plans today's tasks now, not tomorrow night.
  const recent = await db('task_runs').where('created_at', '>', db.raw("now() - interval '20 hours'")).first('id');
  if (!recent) await boss.send(NIGHTLY_TASKS_QUEUE, {});
  await boss.createQueue(TASK_RUN_QUEUE);
  await boss.schedule(TASK_RUN_QUEUE, '* * * * *');
  await boss.work(TASK_RUN_QUEUE, async () => {
    const runs = await runQueuedTaskRuns(db);
    if (runs) log.info({ runs }, 'task runs');
  });
  // Shifts, every five minutes: places of ended shifts not marked done become missed, reminders go
  // from a day before, and each volunteer's weekly e-mail of open shifts on their day (once a week:
  // the shift_digests row is the proof, whichever server gets there first).
  const publicUrl = opts.publicUrl ?? 'http://127.0.0.1:3000';
  await boss.createQueue(SHIFT_QUEUE);
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
