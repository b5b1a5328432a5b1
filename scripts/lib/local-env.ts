import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { startFakeMail, type FakeMail } from '../../fake-mail/server';
import pg from 'pg';
import { ensurePostgresInstalled, firstUnreachable, runningClusterPort, startCluster, type Cluster } from './postgres';

export const root = path.resolve(import.meta.dirname, '..', '..');

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

/** Where clusters live when the project folder is private to root (one folder per project path). */
export const SYSTEM_CLUSTER_ROOT = '/var/lib/tillwell';

export interface ClusterPlace {
  dir: string;
  /** Why this place was chosen, printed at start. */
  reason: 'setting' | 'project' | 'system';
}

/**
 * Chooses the local cluster's folder. TILLWELL_PG_DIR wins; otherwise `.data/pg` inside the
 * project, unless we are root and the unprivileged postgres user cannot enter the project
 * folder (root's home, a mktemp -d folder: mode 0700). Then the cluster lives in
 * /var/lib/tillwell/<hash of the project path>/pg, which that user can reach, and the
 * project folder's permissions are left as they are. A second start, and every db:* script,
 * computes the same place from the same path.
 */
export function chooseClusterPlace(projectRoot: string, dataRoot: string, env = process.env): ClusterPlace {
  if (env.TILLWELL_PG_DIR) return { dir: path.resolve(env.TILLWELL_PG_DIR), reason: 'setting' };
  const inProject = path.join(dataRoot, 'pg');
  // .data itself is ours and is kept enterable; what matters is every folder above it.
  if (!isRoot || firstUnreachable(path.dirname(dataRoot)) === null) return { dir: inProject, reason: 'project' };
  const real = fs.realpathSync(projectRoot);
  const hash = crypto.createHash('sha256').update(real).digest('hex').slice(0, 12);
  const home = path.join(SYSTEM_CLUSTER_ROOT, hash);
  try {
    fs.mkdirSync(home, { recursive: true, mode: 0o755 });
    fs.writeFileSync(path.join(home, 'project'), `${real}\n`);
  } catch {
    // Cannot make a place outside the project: keep the in-project folder and its clear error.
    return { dir: inProject, reason: 'project' };
  }
  if (firstUnreachable(home) !== null) return { dir: inProject, reason: 'project' };
  return { dir: path.join(home, 'pg'), reason: 'system' };
}

export interface LocalServices {
  databaseUrl: string;
  mail: FakeMail | null;
  cluster: Cluster | null;
  stop(): Promise<void>;
}

/**
 * Starts what a developer machine needs: the project-local PostgreSQL cluster (unless
 * DATABASE_URL points elsewhere) and, when asked, the fake inbox.
 */
export async function startLocalServices(opts: { withMail: boolean }): Promise<LocalServices> {
  const dataRoot = process.env.TILLWELL_DATA_DIR ?? path.join(root, '.data');
  // The data folder is ours: keep it enterable so the postgres user can reach its cluster inside.
  fs.mkdirSync(dataRoot, { recursive: true });
  fs.chmodSync(dataRoot, fs.statSync(dataRoot).mode | 0o711);
  let cluster: Cluster | null = null;
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    ensurePostgresInstalled();
    const place = chooseClusterPlace(root, dataRoot);
    const port = Number(process.env.TILLWELL_PG_PORT ?? 54329);
    console.log(
      `PostgreSQL data: ${place.dir} (127.0.0.1:${port})` +
        (place.reason === 'system'
          ? ` — the project folder is private to root, so the cluster lives where the "postgres" user can reach it`
          : ''),
    );
    cluster = startCluster({ dataDir: place.dir, port });
    await cluster.createDatabase('tillwell');
    databaseUrl = cluster.url('tillwell');
  }
  let mail: FakeMail | null = null;
  try {
    if (opts.withMail) {
      mail = await startFakeMail({
        smtpPort: Number(process.env.FAKE_MAIL_SMTP_PORT ?? 2525),
        httpPort: Number(process.env.FAKE_MAIL_HTTP_PORT ?? 8025),
        dir: process.env.FAKE_MAIL_DIR ?? path.join(dataRoot, 'mail'),
      });
    }
  } catch (err) {
    cluster?.stop();
    throw err;
  }
  return {
    databaseUrl,
    mail,
    cluster,
    async stop() {
      await mail?.close();
      cluster?.stop();
    },
  };
}

export interface LocalDatabase {
  databaseUrl: string;
  /** Where the database is, for messages: the URL given, or the local cluster's folder and port. */
  where: string;
  /** Stops the local cluster if this call started it (one `npm start` is running is left alone). */
  stop(): void;
}

/**
 * The database the ops scripts work on: DATABASE_URL when set; otherwise `database` (default `tillwell`)
 * on the local cluster `npm start` uses (same folder, same port setting), created if missing. A cluster
 * that is already running (`npm start` in another terminal) is used where it listens and left running;
 * one that is not is started for the script and stopped after it.
 */
export async function openLocalDatabase(opts: { database?: string } = {}): Promise<LocalDatabase> {
  if (process.env.DATABASE_URL) {
    if (opts.database) throw new Error('--database names a database on the local cluster; with DATABASE_URL set, name the database in the URL.');
    return { databaseUrl: process.env.DATABASE_URL, where: 'DATABASE_URL', stop() {} };
  }
  const name = opts.database ?? 'tillwell';
  if (!/^[a-z_][a-z0-9_]{0,62}$/.test(name)) throw new Error(`--database ${name}: use lower-case letters, digits and _ only.`);
  const dataRoot = process.env.TILLWELL_DATA_DIR ?? path.join(root, '.data');
  fs.mkdirSync(dataRoot, { recursive: true });
  fs.chmodSync(dataRoot, fs.statSync(dataRoot).mode | 0o711);
  ensurePostgresInstalled();
  const place = chooseClusterPlace(root, dataRoot);
  const running = runningClusterPort(place.dir);
  let cluster: Cluster | null = null;
  let port: number;
  if (running !== null) {
    port = running;
  } else {
    port = Number(process.env.TILLWELL_PG_PORT ?? 54329);
    cluster = startCluster({ dataDir: place.dir, port, log: () => {} });
  }
  const url = (db: string) => `postgres://postgres@127.0.0.1:${port}/${db}`;
  try {
    const client = new pg.Client({ connectionString: url('postgres') });
    await client.connect();
    try {
      const found = await client.query('select 1 from pg_database where datname = $1', [name]);
      if (!found.rowCount) await client.query(`create database "${name}"`);
    } finally {
      await client.end();
    }
  } catch (err) {
    cluster?.stop();
    throw err;
  }
  return {
    databaseUrl: url(name),
    where: `the local cluster in ${place.dir} (127.0.0.1:${port}${running !== null ? ', already running' : ''}), database ${name}`,
    stop() {
      cluster?.stop();
    },
  };
}
