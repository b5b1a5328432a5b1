import path from 'node:path';
import { freePort } from '../../scripts/lib/postgres';
import { createDb } from '../../server/db/knex';
import { startServer, type RunningServer } from '../../server/start-server';
import { testConfig, truncateAll } from './app';

const dist = path.resolve(import.meta.dirname, '..', '..', 'dist');

/** Serves the built client and API on a free loopback port over freshly seeded demo data. */
export async function startSeededServer(): Promise<RunningServer> {
  const port = await freePort();
  const config = testConfig({ PORT: String(port), PUBLIC_URL: `http://127.0.0.1:${port}`, STATIC_DIR: dist });
  const db = createDb(config.databaseUrl);
  try {
    await truncateAll(db);
    await db.seed.run();
  } finally {
    await db.destroy();
  }
  return startServer(config);
}
