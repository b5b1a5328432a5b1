import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { loadReferenceCrops } from '../../server/services/reference-crops';
import { testConfig, truncateAll } from '../helpers/app';

// `npm run backup` of the seeded demo database and a few uploads, restored by `npm run restore` into an
// empty database on the same throwaway cluster: every table and every upload comes back the same, and a
// restore into a database that is not empty is refused without changing anything.

const repo = path.resolve(import.meta.dirname, '..', '..');
const tsx = path.join(repo, 'node_modules', 'tsx', 'dist', 'cli.mjs');
const sourceUrl = testConfig().databaseUrl;
const restoredName = `tillwell_restore_${process.pid}`;
const restoredUrl = Object.assign(new URL(sourceUrl), { pathname: `/${restoredName}` }).toString();
const adminUrl = Object.assign(new URL(sourceUrl), { pathname: '/postgres' }).toString();
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-backup-test-'));
const sourceUploads = path.join(work, 'uploads');
const restoredUploads = path.join(work, 'restored-uploads');
const backupFile = path.join(work, 'backup.tar');

/** Runs one of the ops scripts as its own process, as `npm run backup|restore` would. */
function run(script: 'backup' | 'restore', args: string[], env: { DATABASE_URL: string; UPLOAD_DIR: string }) {
  const childEnv: NodeJS.ProcessEnv = { ...process.env, ...env };
  delete childEnv.NODE_OPTIONS;
  delete childEnv.STORAGE;
  const res = spawnSync(process.execPath, [tsx, `scripts/${script}.ts`, ...args], { cwd: repo, env: childEnv, encoding: 'utf8', timeout: 120_000 });
  return { status: res.status, stdout: res.stdout, stderr: res.stderr };
}

async function withClient<T>(url: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/**
 * Every ordinary table of every schema but PostgreSQL's own, with its row count and the md5 of all its
 * rows as text, ordered by its primary key (by the whole row where it has none). Written here rather than
 * taken from the scripts, so the check does not share their code.
 */
function fingerprint(url: string) {
  return withClient(url, async (c) => {
    const { rows: tables } = await c.query<{ oid: number; name: string }>(
      `select c.oid::int as oid, format('%I.%I', n.nspname, c.relname) as name from pg_class c join pg_namespace n on n.oid = c.relnamespace
        where c.relkind in ('r', 'p') and n.nspname not in ('pg_catalog', 'information_schema') and n.nspname not like 'pg_toast%' order by 2`,
    );
    const out: Record<string, { rows: number; md5: string }> = {};
    for (const t of tables) {
      const { rows: pk } = await c.query<{ col: string }>(
        `select format('%I', a.attname) as col from pg_index i join pg_attribute a on a.attrelid = i.indrelid and a.attnum = any(i.indkey)
          where i.indrelid = $1 and i.indisprimary order by array_position(i.indkey, a.attnum)`,
        [t.oid],
      );
      const order = pk.length > 0 ? pk.map((p) => `t.${p.col}`).join(', ') : 't::text';
      const { rows } = await c.query<{ n: number; h: string }>(`select count(*)::int as n, md5(coalesce(string_agg(t::text, E'\\n' order by ${order}), '')) as h from ${t.name} t`);
      out[t.name] = { rows: rows[0].n, md5: rows[0].h };
    }
    return out;
  });
}

/** Each file under a folder (relative path → its bytes' sha256). */
function filesOf(dir: string): Record<string, string> {
  if (!fs.existsSync(dir)) return {};
  const out: Record<string, string> = {};
  for (const rel of fs.readdirSync(dir, { recursive: true, encoding: 'utf8' }).sort()) {
    const abs = path.join(dir, rel);
    if (fs.statSync(abs).isFile()) out[rel.split(path.sep).join('/')] = crypto.createHash('sha256').update(fs.readFileSync(abs)).digest('hex');
  }
  return out;
}

const hex = () => crypto.randomBytes(16).toString('hex');

describe('backup and restore (npm run backup / npm run restore)', () => {
  beforeAll(async () => {
    const db = createDb(sourceUrl);
    try {
      await truncateAll(db);
      await db.seed.run();
      await loadReferenceCrops(db);
    } finally {
      await db.destroy();
    }
    // A few uploads in the layout the storage keeps them in, of different sizes (one empty).
    const base = hex();
    const uploads: Array<[string, Buffer]> = [
      [`site-backgrounds/${hex()}.png`, crypto.randomBytes(200_000)],
      [`observation-photos/${base}.webp`, crypto.randomBytes(30_000)],
      [`observation-photos/${base}-thumb.webp`, crypto.randomBytes(3_000)],
      [`shift-photos/${hex()}.webp`, Buffer.alloc(0)],
    ];
    for (const [key, bytes] of uploads) {
      fs.mkdirSync(path.join(sourceUploads, path.dirname(key)), { recursive: true });
      fs.writeFileSync(path.join(sourceUploads, key), bytes);
    }
    await withClient(adminUrl, (c) => c.query(`create database "${restoredName}"`));
  });

  afterAll(async () => {
    await withClient(adminUrl, (c) => c.query(`drop database if exists "${restoredName}" with (force)`));
    fs.rmSync(work, { recursive: true, force: true });
  });

  it('restores into an empty database every table row for row and every upload byte for byte', async () => {
    const backup = run('backup', [backupFile], { DATABASE_URL: sourceUrl, UPLOAD_DIR: sourceUploads });
    expect(backup.stderr).toBe('');
    expect(backup.status).toBe(0);
    expect(backup.stdout).toMatch(/Uploads: +4 files/);
    expect(backup.stdout).toContain(`Wrote ${backupFile}`);
    // The file holds personal data: its owner alone may read it.
    expect(fs.statSync(backupFile).mode & 0o777).toBe(0o600);

    const restore = run('restore', [backupFile], { DATABASE_URL: restoredUrl, UPLOAD_DIR: restoredUploads });
    expect(restore.stderr).toBe('');
    expect(restore.status).toBe(0);
    expect(restore.stdout).toContain("every table's row count matches the backup's manifest");

    const before = await fingerprint(sourceUrl);
    const after = await fingerprint(restoredUrl);
    // The demo seed fills these, so an empty restore could not pass (seeds/01, 02, 07).
    for (const t of ['public.users', 'public.plots', 'public.shifts', 'public.knex_migrations']) expect(before[t].rows, t).toBeGreaterThan(0);
    expect(Object.keys(after)).toEqual(Object.keys(before));
    expect(after).toEqual(before);
    expect(Object.keys(filesOf(sourceUploads))).toHaveLength(4);
    expect(filesOf(restoredUploads)).toEqual(filesOf(sourceUploads));
  });

  it('refuses to restore into a database that holds tables, and changes nothing there or in the uploads', async () => {
    const elsewhere = path.join(work, 'untouched-uploads');
    const before = await fingerprint(restoredUrl);
    const refused = run('restore', [backupFile], { DATABASE_URL: restoredUrl, UPLOAD_DIR: elsewhere });
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/Refused: .* is not empty: it holds \d+ tables/);
    expect(refused.stderr).toContain('Nothing was changed');
    expect(await fingerprint(restoredUrl)).toEqual(before);
    expect(filesOf(elsewhere)).toEqual({});
  });

  it('with --force, replaces what the database holds with the backup', async () => {
    await withClient(restoredUrl, async (c) => {
      await c.query(`update users set name = 'Changed after the backup' where email = 'lucia@example.org'`);
      await c.query('delete from weather_days where id in (select id from weather_days order by id limit 10)');
    });
    const source = await fingerprint(sourceUrl);
    expect(await fingerprint(restoredUrl)).not.toEqual(source);
    const forced = run('restore', [backupFile, '--force'], { DATABASE_URL: restoredUrl, UPLOAD_DIR: restoredUploads });
    expect(forced.stderr).toBe('');
    expect(forced.status).toBe(0);
    expect(forced.stdout).toContain('4 replaced a file of the same name');
    expect(await fingerprint(restoredUrl)).toEqual(source);
  });
});
