import type { Knex } from 'knex';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { sweepDeadlines } from './deadlines';

export const DEADLINE_QUEUE = 'deadline-sweep';

export interface Jobs {
  stop(): Promise<void>;
}

/**
 * Starts the Postgres-backed job queue (pg-boss): a sweep of offer and renewal deadlines every
 * minute, plus one at start-up so nothing due while the server was down waits longer. The
 * schedule lives in the database, so several servers side by side run it once a minute.
 */
export async function startJobs(databaseUrl: string, db: Knex, log: Pick<Logger, 'info' | 'error'>): Promise<Jobs> {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 3 });
  boss.on('error', (err) => log.error({ err }, 'job queue error'));
  await boss.start();
  await boss.createQueue(DEADLINE_QUEUE);
  await boss.schedule(DEADLINE_QUEUE, '* * * * *');
  await boss.work(DEADLINE_QUEUE, async () => {
    const done = await sweepDeadlines(db, new Date());
    if (done.offersLapsed || done.renewalsLapsed) log.info(done, 'deadlines swept');
  });
  await boss.send(DEADLINE_QUEUE, {});
  return {
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
    },
  };
}
