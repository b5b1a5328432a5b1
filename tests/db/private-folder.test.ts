import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort } from '../../scripts/lib/postgres';
import { SYSTEM_CLUSTER_ROOT } from '../../scripts/lib/local-env';

// A fresh checkout in a folder only root can enter (as in /root, or any mktemp -d folder):
// the db scripts must still create, find again and use the local cluster, without
// loosening the folder's permissions.
const repo = path.resolve(import.meta.dirname, '..', '..');
const isRoot = process.getuid?.() === 0;
const skipped = new Set(['node_modules', '.data', 'dist', '.git', 'test-results', 'screenshots', 'coverage']);

describe.runIf(isRoot)('local cluster for a checkout in a private folder (as root)', () => {
  const privateDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-private-'));
  const checkout = path.join(privateDir, 'tillwell');
  const hash = crypto.createHash('sha256').update(checkout).digest('hex').slice(0, 12);
  const place = path.join(SYSTEM_CLUSTER_ROOT, hash);

  afterAll(() => {
    fs.rmSync(place, { recursive: true, force: true });
    fs.rmSync(privateDir, { recursive: true, force: true });
  });

  it('keeps the cluster in /var/lib/tillwell/<hash>/pg, owned by postgres with mode 0700, and finds it again', async () => {
    fs.cpSync(repo, checkout, { recursive: true, filter: (src) => !skipped.has(path.basename(src)) || path.dirname(src) !== repo });
    fs.symlinkSync(path.join(repo, 'node_modules'), path.join(checkout, 'node_modules'));
    expect(fs.statSync(privateDir).mode & 0o777).toBe(0o700);

    const env: NodeJS.ProcessEnv = { ...process.env, TILLWELL_PG_PORT: String(await freePort()) };
    for (const name of ['DATABASE_URL', 'TILLWELL_PG_DIR', 'TILLWELL_DATA_DIR', 'NODE_OPTIONS']) delete env[name];
    const run = () =>
      spawnSync(process.execPath, [path.join(checkout, 'node_modules', 'tsx', 'dist', 'cli.mjs'), 'scripts/db.ts', 'migrate'], {
        cwd: checkout,
        env,
        encoding: 'utf8',
        timeout: 120_000,
      });

    const first = run();
    expect(first.stderr).not.toMatch(/cannot enter/);
    expect(first.status).toBe(0);
    expect(first.stdout).toContain(`PostgreSQL data: ${path.join(place, 'pg')}`);
    expect(first.stdout).toMatch(/Migrated: \d{3}/);

    const pgDir = fs.statSync(path.join(place, 'pg'));
    const postgresUid = Number(spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).stdout.trim());
    expect(pgDir.uid).toBe(postgresUid);
    expect(pgDir.mode & 0o777).toBe(0o700);
    expect(fs.readFileSync(path.join(place, 'project'), 'utf8').trim()).toBe(checkout);
    // Nothing above the project was loosened, nor the project folder itself.
    expect(fs.statSync(privateDir).mode & 0o777).toBe(0o700);

    const second = run();
    expect(second.status).toBe(0);
    expect(second.stdout).toContain(`PostgreSQL data: ${path.join(place, 'pg')}`);
    expect(second.stdout).toContain('Already up to date.');
  }, 180_000);
});
