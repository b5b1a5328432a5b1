import { taskRunsIdle } from './services/task-runs';
import type { Server } from 'node:http';
import { configWarnings, type Config } from './config';
import { createDb } from './db/knex';
import { createApp } from './app';
import { startJobs } from './jobs';
import { createMailer } from './mail/mailer';
import { mailIdle } from './services/outbox';
import { loadReferenceCrops } from './services/reference-crops';
import { bringFindingsUpToDate } from './services/findings';
import { pino } from 'pino';

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

/** Migrates the database and loads the reference crops, then serves the API and the built client on config.host:port. */
export async function startServer(config: Config): Promise<RunningServer> {
  const log = pino({ level: config.logLevel });
  for (const warning of configWarnings(config)) log.warn(warning);
  const db = createDb(config.databaseUrl);
  await db.migrate.latest();
  await bringFindingsUpToDate(db, await loadReferenceCrops(db));
  const mailer = createMailer(config.smtpUrl, config.mailFrom);
  const built = createApp({ db, mailer, config });
  const jobs = await startJobs(config.databaseUrl, db, mailer, log, { publicUrl: config.publicUrl });
  const server: Server = await new Promise((resolve, reject) => {
    const s = built.app.listen(config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const addr = server.address();
  const port = typeof addr === 'object' && addr ? addr.port : config.port;
  return {
    url: `http://${config.host}:${port}`,
    async stop() {
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
      await jobs.stop();
      await taskRunsIdle(db);
      await built.close();
      await mailIdle(); // mail being sent after a commit finishes first
      mailer.close();
      await db.destroy();
    },
  };
}
