import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { register } from 'tsx/esm/api';
import { startFakeMail } from '../../fake-mail/server';
import { freePort, removeDir, startCluster } from '../../scripts/lib/postgres';
import { ensureChromium } from '../helpers/chromium';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    mailUrl: string;
    smtpUrl: string;
    uploadDir: string;
  }
}

// One throwaway PostgreSQL cluster and fake inbox for the whole run, removed afterwards.
export default async function setup(project: TestProject) {
  register(); // lets knex load the TypeScript migrations in this process
  ensureChromium();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-test-pg-'));
  fs.chmodSync(dir, 0o755);
  const cluster = startCluster({ dataDir: path.join(dir, 'data'), port: await freePort(), throwaway: true, log: () => {} });
  const mailDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-test-mail-'));
  const uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-test-uploads-'));
  const mail = await startFakeMail({ smtpPort: 0, httpPort: 0, dir: mailDir });
  try {
    await cluster.createDatabase('tillwell_test');
    const { createDb } = await import('../../server/db/knex');
    const { loadReferenceCrops } = await import('../../server/services/reference-crops');
    const db = createDb(cluster.url('tillwell_test'));
    await db.migrate.latest();
    await loadReferenceCrops(db);
    await db.destroy();
  } catch (err) {
    await mail.close();
    cluster.stop();
    throw err;
  }
  project.provide('databaseUrl', cluster.url('tillwell_test'));
  project.provide('mailUrl', mail.url);
  project.provide('smtpUrl', mail.smtpUrl);
  project.provide('uploadDir', uploadDir);

  return async () => {
    await mail.close();
    cluster.stop();
    removeDir(dir);
    removeDir(mailDir);
    removeDir(uploadDir);
    // No test may leave a server behind; say so loudly if one did.
    const left = spawnSync('sh', ['-c', `pgrep -f "[p]ostgres -D ${dir}" || true`], { encoding: 'utf8' }).stdout.trim();
    if (left) console.warn(`processes still running for ${dir}: ${left}`);
  };
}
