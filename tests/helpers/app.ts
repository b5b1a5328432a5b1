import type { Knex } from 'knex';
import type { DestinationStream } from 'pino';
import request from 'supertest';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { createDb } from '../../server/db/knex';
import { createMailer } from '../../server/mail/mailer';
import { mailIdle } from '../../server/services/outbox';
import { loadReferenceCrops } from '../../server/services/reference-crops';

export const mailUrl = () => inject('mailUrl');

/** Configuration for tests: the throwaway database and fake inbox, quick hashing, quiet logs. */
export function testConfig(env: Record<string, string> = {}): Config {
  return loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: inject('databaseUrl'),
    SMTP_URL: inject('smtpUrl'),
    PUBLIC_URL: 'http://127.0.0.1:3999',
    BCRYPT_COST: '10',
    AUTH_RATE_LIMIT: '1000',
    // Every test signs in from 127.0.0.1; tests of the limits set their own values.
    SIGNIN_MAX_FAILURES_PER_ADDRESS: '1000',
    LOG_LEVEL: 'silent',
    STATIC_DIR: '/nonexistent',
    // Uploads from tests go to the throwaway temp folder, never into the checkout's .data.
    UPLOAD_DIR: inject('uploadDir'),
    ...env,
  });
}

/**
 * A database handle, an app and a way to close them, for one test file. `extra.db` replaces the
 * database handle (e.g. one that fails on purpose; it is closed with the app) and
 * `extra.logDestination` receives the app's log lines.
 */
export function setupTestApp(
  env: Record<string, string> = {},
  extra: { db?: Knex; logDestination?: DestinationStream } = {},
) {
  const config = testConfig(env);
  const db = extra.db ?? createDb(config.databaseUrl);
  const mailer = createMailer(config.smtpUrl, config.mailFrom);
  const built = createApp({ db, mailer, config, logDestination: extra.logDestination });
  return {
    db,
    config,
    mailer,
    app: built.app,
    async close() {
      await built.close();
      await mailIdle();
      mailer.close();
      await db.destroy();
    },
  };
}

/** Empties every table the product writes (not the migrations' own bookkeeping), then loads the reference crops again. */
export async function truncateAll(db: Knex) {
  // Mail a test's requests are still sending belongs to that test, not the next one.
  await mailIdle();
  const { rows } = await db.raw(
    "select tablename from pg_tables where schemaname = 'public' and tablename not like 'knex_%'",
  );
  const names = rows.map((r: { tablename: string }) => `"${r.tablename}"`).join(', ');
  if (names) await db.raw(`truncate table ${names} restart identity cascade`);
  // Reference crops are part of the product, not test data: every test starts with them (two bulk inserts).
  await loadReferenceCrops(db);
}

/** A cookie-keeping client that already holds the session's CSRF token. */
export async function browserLikeAgent(app: Parameters<typeof request.agent>[0]) {
  const agent = request.agent(app);
  const res = await agent.get('/api/session').expect(200);
  let csrf: string = res.body.csrfToken;
  return {
    agent,
    get csrf() {
      return csrf;
    },
    async refresh() {
      csrf = (await agent.get('/api/session').expect(200)).body.csrfToken;
    },
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => agent.post(url).set('X-CSRF-Token', csrf).send(body),
    put: (url: string, body?: object) => agent.put(url).set('X-CSRF-Token', csrf).send(body),
    patch: (url: string, body?: object) => agent.patch(url).set('X-CSRF-Token', csrf).send(body),
    delete: (url: string) => agent.delete(url).set('X-CSRF-Token', csrf),
    async signIn(email: string, password: string) {
      const r = await agent.post('/api/session').set('X-CSRF-Token', csrf).send({ email, password });
      if (r.status === 200) csrf = r.body.csrfToken;
      return r;
    },
  };
}
