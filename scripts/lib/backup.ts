import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type pg from 'pg';
import { findPgBinDir } from './postgres';

// What the backup and restore scripts share: the file's layout, the PostgreSQL client tools and the
// per-table row counts both print.

/** The backup file: one tar holding these, and the uploads under `uploads/<folder>/<name>`. */
export const MANIFEST = 'manifest.json';
export const DUMP = 'database.dump';
export const UPLOADS = 'uploads';
export const FORMAT = 'tillwell-backup';
export const FORMAT_VERSION = 1;

export interface Manifest {
  format: typeof FORMAT;
  version: number;
  createdAt: string;
  /** `pg_dump --version` and the server's version, for knowing which tools restore it. */
  pgDump: string;
  serverVersion: string;
  /** Rows in each table of every schema (`schema.table`), counted in the snapshot pg_dump dumped. */
  tables: Record<string, number>;
  uploads: { storage: 'local' | 's3'; files: number; bytes: number };
}

/** A PostgreSQL client tool (pg_dump, pg_restore) from the same Debian install `npm start` uses. */
export function pgTool(tool: 'pg_dump' | 'pg_restore' | 'psql'): string {
  const dir = findPgBinDir();
  const bin = dir ? path.join(dir, tool) : null;
  if (!bin || !fs.existsSync(bin)) {
    throw new Error(`${tool} was not found. Install Debian's "postgresql-client" (or "postgresql") package and run this again.`);
  }
  return bin;
}

/**
 * Runs a client tool on a database URL without putting its password on the command line (where any
 * user's `ps` shows it): the password goes in PGPASSWORD, the rest of the URL in --dbname.
 */
export function runPgTool(bin: string, databaseUrl: string, args: string[]) {
  const url = new URL(databaseUrl);
  const password = decodeURIComponent(url.password);
  url.password = '';
  const env = { ...process.env, ...(password ? { PGPASSWORD: password } : {}) };
  const res = spawnSync(bin, [...args, '--dbname', url.toString()], { encoding: 'utf8', env });
  if (res.error) throw res.error;
  return res;
}

export function toolVersion(bin: string): string {
  return spawnSync(bin, ['--version'], { encoding: 'utf8' }).stdout.trim();
}

/** Every ordinary table outside PostgreSQL's own schemas, as `schema.table`, sorted. */
export async function userTables(client: pg.ClientBase): Promise<string[]> {
  const { rows } = await client.query<{ name: string }>(
    `select n.nspname || '.' || c.relname as name
       from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where c.relkind in ('r', 'p') and n.nspname not in ('pg_catalog', 'information_schema') and n.nspname not like 'pg_toast%'
      order by 1`,
  );
  return rows.map((r) => r.name);
}

export const quoteTable = (name: string) => {
  const dot = name.indexOf('.');
  return `"${name.slice(0, dot).replace(/"/g, '""')}"."${name.slice(dot + 1).replace(/"/g, '""')}"`;
};

/** Row counts of the given tables in one query. */
export async function countRows(client: pg.ClientBase, tables: string[]): Promise<Record<string, number>> {
  if (tables.length === 0) return {};
  const sql = tables.map((t, i) => `select ${i} as i, count(*)::bigint as n from ${quoteTable(t)}`).join(' union all ');
  const { rows } = await client.query<{ i: number; n: string }>(sql);
  return Object.fromEntries(rows.map((r) => [tables[r.i], Number(r.n)]));
}

/** Regular files under a folder as `folder/name` keys (hidden and temporary files left out), sorted. */
export function uploadFiles(dir: string): Array<{ key: string; file: string; bytes: number }> {
  const out: Array<{ key: string; file: string; bytes: number }> = [];
  const walk = (abs: string, rel: string) => {
    for (const entry of fs.readdirSync(abs, { withFileTypes: true })) {
      if (entry.name.startsWith('.')) continue;
      const a = path.join(abs, entry.name);
      const r = rel ? `${rel}/${entry.name}` : entry.name;
      if (entry.isDirectory()) walk(a, r);
      else if (entry.isFile()) out.push({ key: r, file: a, bytes: fs.statSync(a).size });
    }
  };
  if (fs.existsSync(dir)) walk(dir, '');
  return out.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
}

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KiB`;
  return `${(n / 1024 / 1024).toFixed(1)} MiB`;
}

/** Splits `--flag` options from positional arguments (also accepting `--name=value` and `--name value`). */
export function parseArgs(argv: string[], valued: string[] = []) {
  const flags = new Map<string, string | true>();
  const positional: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (!a.startsWith('--')) {
      positional.push(a);
      continue;
    }
    const [name, value] = a.slice(2).split(/=(.*)/s, 2);
    if (value !== undefined) flags.set(name, value);
    else if (valued.includes(name) && i + 1 < argv.length) flags.set(name, argv[++i]);
    else flags.set(name, true);
  }
  return { flags, positional };
}
