import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import * as tar from 'tar';
import { loadConfig } from '../server/config';
import { assertKey, contentTypeOf, createStorage } from '../server/storage';
import { countRows, DUMP, FORMAT, FORMAT_VERSION, formatBytes, MANIFEST, type Manifest, parseArgs, pgTool, runPgTool, UPLOADS, uploadFiles, userTables } from './lib/backup';
import { openLocalDatabase } from './lib/local-env';

// `npm run restore FILE [-- --force] [--database NAME]`: a file from `npm run backup` into an empty
// database (pg_restore, in one transaction), then its uploads into the configured storage. A database
// that already holds tables is refused, and nothing is changed, unless --force: then every object the
// backup holds is dropped and made again from it (tables it does not hold are left as they are).

const { flags, positional } = parseArgs(process.argv.slice(2), ['database']);
const known = new Set(['force', 'database', 'help']);
if (positional.length !== 1 || flags.has('help') || [...flags.keys()].some((f) => !known.has(f))) {
  console.error('Usage: npm run restore FILE.tar [-- --force] [--database NAME]');
  process.exit(2);
}
const file = path.resolve(positional[0]);
const force = flags.get('force') === true;
const database = flags.get('database');

async function main(): Promise<number> {
  if (!fs.existsSync(file)) {
    console.error(`${file} does not exist.`);
    return 1;
  }
  const staging = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-restore-'));
  try {
    // tar leaves out absolute paths and `..` in entry names, so nothing lands outside the staging folder.
    await tar.x({ file, cwd: staging, strict: true, preserveOwner: false });
    const manifestFile = path.join(staging, MANIFEST);
    const dumpFile = path.join(staging, DUMP);
    if (!fs.existsSync(manifestFile) || !fs.existsSync(dumpFile)) {
      console.error(`${file} is not a Tillwell backup (it holds no ${MANIFEST} and ${DUMP}).`);
      return 1;
    }
    const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Manifest;
    if (manifest.format !== FORMAT || manifest.version !== FORMAT_VERSION) {
      console.error(`${file} is a backup of format ${manifest.format} ${manifest.version}; this restore reads ${FORMAT} ${FORMAT_VERSION}.`);
      return 1;
    }

    const local = await openLocalDatabase({ database: typeof database === 'string' ? database : undefined });
    try {
      const config = loadConfig({ ...process.env, DATABASE_URL: local.databaseUrl });
      const client = new pg.Client({ connectionString: config.databaseUrl });
      await client.connect();
      try {
        const present = await userTables(client);
        if (present.length > 0 && !force) {
          const ours = present.filter((t) => t.startsWith('public.'));
          console.error(
            `Refused: ${local.where} is not empty: it holds ${present.length} tables (${ours.length} of them Tillwell's, e.g. ${present.slice(0, 3).join(', ')}). ` +
              'Nothing was changed. Restore into an empty database, or pass --force to drop and replace everything the backup holds.',
          );
          return 1;
        }
        console.log(`Restoring ${file} (made ${manifest.createdAt}) into ${local.where}${force && present.length > 0 ? ', replacing what is there (--force)' : ''}…`);

        let res;
        if (force && present.length > 0) {
          // pg_restore --clean cannot drop pg-boss's partitioned tables one constraint at a time, so the
          // replacement is one psql transaction: drop the schemas that hold tables, then the dump's script.
          const script = path.join(staging, 'restore.sql');
          const made = spawnSync(pgTool('pg_restore'), ['--format=custom', '--no-owner', '--no-privileges', '--file', script, dumpFile], { encoding: 'utf8' });
          if (made.status !== 0) {
            console.error(`pg_restore could not read the dump (exit ${made.status}):\n${made.stderr.trim()}`);
            return 1;
          }
          const body = fs.readFileSync(script, 'utf8');
          const schemas = [...new Set(present.map((t) => t.split('.')[0]))];
          const before = [
            'set client_min_messages = warning;',
            ...schemas.map((name) => `drop schema if exists "${name.replace(/"/g, '""')}" cascade;`),
            /^CREATE SCHEMA public;/m.test(body) ? '' : 'create schema public;',
          ].join('\n');
          fs.writeFileSync(script, `${before}\n${body}`);
          res = runPgTool(pgTool('psql'), config.databaseUrl, ['--no-psqlrc', '--quiet', '--single-transaction', '--set', 'ON_ERROR_STOP=1', '--no-password', '--output', '/dev/null', '--file', script]);
        } else {
          const args = ['--format=custom', '--no-owner', '--no-privileges', '--exit-on-error', '--single-transaction', '--no-password'];
          res = runPgTool(pgTool('pg_restore'), config.databaseUrl, [...args, dumpFile]);
        }
        if (res.status !== 0) {
          console.error(`pg_restore failed (exit ${res.status}); its transaction was rolled back:\n${res.stderr.trim()}`);
          return 1;
        }
        const tables = Object.keys(manifest.tables);
        const counts = await countRows(client, tables);
        const differ = tables.filter((t) => counts[t] !== manifest.tables[t]);
        const rows = Object.values(counts).reduce((a, b) => a + b, 0);
        if (differ.length > 0) {
          console.error(`Restored, but ${differ.length} tables' row counts differ from the backup's: ${differ.map((t) => `${t} ${counts[t]} (backup ${manifest.tables[t]})`).join(', ')}`);
          return 1;
        }
        console.log(`  Database: ${tables.length} tables, ${rows} rows; every table's row count matches the backup's manifest.`);
      } finally {
        await client.end();
      }

      const storage = createStorage(config);
      const files = uploadFiles(path.join(staging, UPLOADS));
      let replaced = 0;
      let bytes = 0;
      const skipped: string[] = [];
      for (const f of files) {
        try {
          assertKey(f.key);
        } catch {
          skipped.push(f.key);
          continue;
        }
        if (await storage.exists(f.key)) replaced++;
        await storage.put(f.key, fs.readFileSync(f.file), contentTypeOf(f.key));
        bytes += f.bytes;
      }
      const into = config.storage.kind === 'local' ? `the upload folder ${path.resolve(config.uploadDir)}` : `the S3 bucket "${config.storage.bucket}"`;
      if (manifest.uploads.storage === 's3' && files.length === 0) {
        console.log('  Uploads:  none in this file (they were kept in an S3 bucket when it was made).');
      } else {
        console.log(`  Uploads:  ${files.length - skipped.length} files, ${formatBytes(bytes)} put into ${into} (${replaced} replaced a file of the same name).`);
      }
      if (skipped.length > 0) console.warn(`  Warning: ${skipped.length} file(s) under uploads/ do not have a storage key's shape and were left out: ${skipped.slice(0, 3).join(', ')}`);
      if (files.length - skipped.length !== manifest.uploads.files) {
        console.error(`The file holds ${files.length - skipped.length} uploads; its manifest says ${manifest.uploads.files}.`);
        return 1;
      }
      console.log('Restored.');
      return 0;
    } finally {
      local.stop();
    }
  } finally {
    fs.rmSync(staging, { recursive: true, force: true });
  }
}

try {
  process.exitCode = await main();
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
}
