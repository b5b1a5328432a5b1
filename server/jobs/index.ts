import type { Knex } from 'knex';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Mailer } from '../mail/mailer';
import { sendDueMail } from '../services/outbox';
import { pruneIdempotencyKeys } from '../middleware/idempotency';
import { sweepDeadlines } from './deadlines';

export const DEADLINE_QUEUE = 'deadline-sweep';
export const MAIL_QUEUE = 'mail-send';

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
export async function startJobs(databaseUrl: string, db: Knex, mailer: Mailer, log: Pick<Logger, 'info' | 'error'>): Promise<Jobs> {
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
  return {
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
    },
  };
}
