import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import * as tar from 'tar';
import { loadConfig } from '../server/config';
import {
  countRows,
  DUMP,
  FORMAT,
  FORMAT_VERSION,
  formatBytes,
  MANIFEST,
  type Manifest,
  parseArgs,
  pgTool,
  runPgTool,
  toolVersion,
  UPLOADS,
  uploadFiles,
  userTables,
} from './lib/backup';
import { openLocalDatabase, root } from './lib/local-env';

// `npm run backup [FILE] [-- --database NAME]`: one tar file holding manifest.json, database.dump
// (pg_dump's custom format, the whole database) and uploads/ (the upload folder, when uploads are kept
// on this machine). The row counts in the manifest are counted in the snapshot pg_dump dumps.

const { flags, positional } = parseArgs(process.argv.slice(2), ['database']);
if (positional.length > 1 || flags.has('help') || [...flags.keys()].some((f) => f !== 'database' && f !== 'help')) {
  console.error('Usage: npm run backup [FILE.tar] [-- --database NAME]');
  process.exit(2);
}
const stamp = new Date().toISOString().replace(/\..*$/, '').replace(/[-:]/g, '').replace('T', '-');
const target = path.resolve(positional[0] ?? path.join(root, '.data', 'backups', `tillwell-${stamp}.tar`));
if (fs.existsSync(target)) {
  console.error(`${target} already exists; name another file (a backup never overwrites one).`);
  process.exit(1);
}
const database = flags.get('database');
const local = await openLocalDatabase({ database: typeof database === 'string' ? database : undefined });
const staging = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-backup-'));
const part = `${target}.part`;
try {
  const config = loadConfig({ ...process.env, DATABASE_URL: local.databaseUrl });
  console.log(`Backing up ${local.where}…`);
  const pgDump = pgTool('pg_dump');
  const dumpFile = path.join(staging, DUMP);

  // One snapshot for the counts, the list of uploads the rows name, and pg_dump itself.
  const client = new pg.Client({ connectionString: config.databaseUrl });
  await client.connect();
  let tables: Record<string, number>;
  let serverVersion: string;
  let named: string[] = [];
  try {
    await client.query('begin transaction isolation level repeatable read, read only');
    const snapshot = (await client.query<{ s: string }>('select pg_export_snapshot() as s')).rows[0].s;
    serverVersion = (await client.query<{ v: string }>("select current_setting('server_version') as v")).rows[0].v;
    const names = await userTables(client);
    tables = await countRows(client, names);
    named = await uploadsNamed(client, names);
    const res = runPgTool(pgDump, config.databaseUrl, ['--format=custom', '--no-password', `--snapshot=${snapshot}`, '--file', dumpFile]);
    if (res.status !== 0) throw new Error(`pg_dump failed (exit ${res.status}):\n${res.stderr.trim()}`);
    await client.query('commit');
  } finally {
    await client.end();
  }
  const dumpBytes = fs.statSync(dumpFile).size;

  const files = config.storage.kind === 'local' ? uploadFiles(config.uploadDir) : [];
  const uploadBytes = files.reduce((sum, f) => sum + f.bytes, 0);
  const manifest: Manifest = {
    format: FORMAT,
    version: FORMAT_VERSION,
    createdAt: new Date().toISOString(),
    pgDump: toolVersion(pgDump),
    serverVersion,
    tables,
    uploads: { storage: config.storage.kind, files: files.length, bytes: uploadBytes },
  };
  fs.writeFileSync(path.join(staging, MANIFEST), `${JSON.stringify(manifest, null, 2)}\n`);

  // Personal data and password hashes: the file is readable by its owner only, and appears whole or not at all.
  fs.mkdirSync(path.dirname(target), { recursive: true });
  fs.writeFileSync(part, '', { mode: 0o600 });
  await tar.c({ file: part, cwd: staging, portable: true }, [MANIFEST, DUMP]);
  if (files.length > 0) {
    await tar.r({ file: part, cwd: path.resolve(config.uploadDir), prefix: UPLOADS, portable: true }, files.map((f) => f.key));
  }
  fs.renameSync(part, target);

  const rows = Object.values(tables).reduce((a, b) => a + b, 0);
  console.log(`  Database: ${Object.keys(tables).length} tables, ${rows} rows (${manifest.pgDump}, server ${serverVersion}): ${DUMP} ${formatBytes(dumpBytes)}`);
  if (config.storage.kind === 'local') {
    console.log(`  Uploads:  ${files.length} files, ${formatBytes(uploadBytes)} from ${path.resolve(config.uploadDir)}`);
    const have = new Set(files.map((f) => f.key));
    const missing = named.filter((k) => !have.has(k));
    if (missing.length > 0) {
      console.warn(`  Warning: ${missing.length} upload(s) the database names are not in the upload folder (e.g. ${missing.slice(0, 3).join(', ')}).`);
    }
  } else {
    console.log(`  Uploads:  not in this file: they are kept in the S3 bucket "${config.storage.bucket}" (${named.length} named by the database); back the bucket up on its own (versioning or replication).`);
  }
  console.log(`Wrote ${target} (${formatBytes(fs.statSync(target).size)}).`);
} catch (err) {
  fs.rmSync(part, { force: true });
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  fs.rmSync(staging, { recursive: true, force: true });
  local.stop();
}

/** The storage keys the database's rows point at (site backgrounds, plot-book photos, done photos). */
async function uploadsNamed(client: pg.Client, tables: string[]): Promise<string[]> {
  const parts: string[] = [];
  if (tables.includes('public.sites')) parts.push(`select 'site-backgrounds/' || background_file as k from public.sites where background_file is not null`);
  if (tables.includes('public.observation_photos')) {
    parts.push(`select 'observation-photos/' || file_name from public.observation_photos`, `select 'observation-photos/' || thumb_name from public.observation_photos`);
  }
  if (tables.includes('public.shift_claims')) parts.push(`select 'shift-photos/' || photo_path from public.shift_claims where photo_path is not null`);
  if (parts.length === 0) return [];
  return (await client.query<{ k: string }>(parts.join(' union all '))).rows.map((r) => r.k);
}
