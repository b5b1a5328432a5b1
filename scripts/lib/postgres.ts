import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import pg from 'pg';

// Local PostgreSQL from Debian's packages, run as an unprivileged user on loopback only.
// Trust authentication is acceptable here only because the cluster listens on 127.0.0.1
// and has no Unix socket; any other setup must use a password (see README).

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const RUN_AS = 'postgres';

function exists(p: string): boolean {
  try {
    fs.accessSync(p, fs.constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** Finds the folder holding initdb and pg_ctl, preferring the newest Debian install. */
export function findPgBinDir(): string | null {
  const base = '/usr/lib/postgresql';
  if (fs.existsSync(base)) {
    const versions = fs
      .readdirSync(base)
      .filter((v) => exists(path.join(base, v, 'bin', 'pg_ctl')))
      .sort((a, b) => Number(b) - Number(a));
    if (versions.length > 0) return path.join(base, versions[0], 'bin');
  }
  const which = spawnSync('sh', ['-c', 'command -v pg_ctl'], { encoding: 'utf8' });
  const found = which.stdout.trim();
  if (which.status === 0 && found) return path.dirname(fs.realpathSync(found));
  return null;
}

/** Makes sure PostgreSQL's server binaries are present, installing Debian's package when root. */
export function ensurePostgresInstalled(log: (m: string) => void = console.log): string {
  const found = findPgBinDir();
  if (found && exists(path.join(found, 'initdb'))) return found;
  const hasApt = spawnSync('sh', ['-c', 'command -v apt-get']).status === 0;
  if (!isRoot || !hasApt) {
    throw new Error(
      'PostgreSQL server binaries (initdb, pg_ctl) were not found. Install Debian\'s "postgresql" package ' +
        '(as root: apt-get update && apt-get install -y postgresql) and run this again.',
    );
  }
  log('PostgreSQL is missing: installing Debian\'s "postgresql" package (apt-get)…');
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', 'postgresql'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  const after = findPgBinDir();
  if (!after) throw new Error('apt-get installed postgresql but initdb/pg_ctl still cannot be found.');
  return after;
}

function runPg(binDir: string, tool: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const bin = path.join(binDir, tool);
  const [cmd, cmdArgs] = isRoot ? ['runuser', ['-u', RUN_AS, '--', bin, ...args]] : [bin, args];
  const res = spawnSync(cmd, cmdArgs, { encoding: 'utf8', cwd: '/' });
  if (res.status !== 0 && !opts.allowFail) {
    throw new Error(`${tool} ${args.join(' ')} failed (exit ${res.status}):\n${res.stdout}\n${res.stderr}`);
  }
  return res;
}

/** Checks that every folder above dir can be entered by the user Postgres runs as. */
function assertReachable(dir: string) {
  if (!isRoot) return;
  const res = spawnSync('runuser', ['-u', RUN_AS, '--', 'test', '-x', dir, '-a', '-w', dir]);
  if (res.status !== 0) {
    throw new Error(
      `PostgreSQL must run as the unprivileged user "${RUN_AS}", and that user cannot reach ${dir}. ` +
        'Every folder above it must be searchable by others (e.g. chmod o+x on a 0700 home folder), ' +
        'or set TILLWELL_PG_DIR to a folder it can reach.',
    );
  }
}

/**
 * The port of a cluster already running from dataDir (as `npm start` leaves it), or null when none is.
 * Read from postmaster.pid, whose fourth line is the port (PostgreSQL's pidfile.h, LOCK_FILE_LINE_PORT).
 */
export function runningClusterPort(dataDir: string): number | null {
  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) return null;
  const binDir = findPgBinDir();
  if (!binDir) return null;
  if (runPg(binDir, 'pg_ctl', ['-D', dataDir, 'status'], { allowFail: true }).status !== 0) return null;
  try {
    const port = Number(fs.readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[3]);
    return Number.isInteger(port) && port > 0 ? port : null;
  } catch {
    return null;
  }
}

/** Asks the kernel for a free TCP port on loopback. */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export interface ClusterOptions {
  dataDir: string;
  port: number;
  /** Speed over durability: only for clusters that are thrown away after tests. */
  throwaway?: boolean;
  log?: (m: string) => void;
}

export interface Cluster {
  port: number;
  dataDir: string;
  /** Connection URL for a database on this cluster. */
  url(database: string): string;
  createDatabase(name: string): Promise<boolean>;
  stop(): void;
}

/** Creates the cluster on first use, starts it on 127.0.0.1 and returns a handle to stop it. */
export function startCluster(opts: ClusterOptions): Cluster {
  const log = opts.log ?? console.log;
  const binDir = ensurePostgresInstalled(log);
  const { dataDir, port } = opts;
  const parent = path.dirname(dataDir);
  fs.mkdirSync(parent, { recursive: true });
  if (isRoot) assertParentsSearchable(parent);

  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
    fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    if (isRoot) execFileSync('chown', [`${RUN_AS}:`, dataDir]);
    assertReachable(dataDir);
    log(`Creating a local PostgreSQL cluster in ${dataDir}…`);
    runPg(binDir, 'initdb', ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  }
  const logFile = path.join(dataDir, 'server.log');
  const status = runPg(binDir, 'pg_ctl', ['-D', dataDir, 'status'], { allowFail: true });
  if (status.status === 0) {
    log(`PostgreSQL in ${dataDir} was already running: stopping it first.`);
    runPg(binDir, 'pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop'], { allowFail: true });
  }
  const settings = [
    `-c listen_addresses=127.0.0.1`,
    `-p ${port}`,
    `-c unix_socket_directories=''`,
    ...(opts.throwaway ? ['-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off'] : []),
  ].join(' ');
  runPg(binDir, 'pg_ctl', ['-D', dataDir, '-l', logFile, '-w', '-t', '60', '-o', settings, 'start']);

  let stopped = false;
  const url = (db: string) => `postgres://postgres@127.0.0.1:${port}/${db}`;
  return {
    port,
    dataDir,
    url,
    async createDatabase(name: string) {
      const client = new pg.Client({ connectionString: url('postgres') });
      await client.connect();
      try {
        const found = await client.query('select 1 from pg_database where datname = $1', [name]);
        if (found.rowCount) return false;
        await client.query(`create database "${name.replace(/"/g, '')}"`);
        return true;
      } finally {
        await client.end();
      }
    },
    stop() {
      if (stopped) return;
      stopped = true;
      runPg(binDir, 'pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop'], { allowFail: true });
    },
  };
}

/** The first folder on the way to dir (dir included) that the postgres user cannot enter, or null. */
export function firstUnreachable(dir: string): string | null {
  if (!isRoot) return null;
  let cur = path.resolve(dir);
  // Walk up to the first folder that exists; folders still to be made will be ours.
  while (!fs.existsSync(cur) && path.dirname(cur) !== cur) cur = path.dirname(cur);
  const chain: string[] = [];
  for (let c = cur; ; c = path.dirname(c)) {
    chain.push(c);
    if (path.dirname(c) === c) break;
  }
  for (const c of chain.reverse()) {
    const res = spawnSync('runuser', ['-u', RUN_AS, '--', 'test', '-x', c]);
    if (res.status !== 0) return c;
  }
  return null;
}

/** Whether the postgres user exists on this machine (Debian's package creates it). */
export function postgresUserExists(): boolean {
  return spawnSync('id', ['-u', RUN_AS]).status === 0;
}

function assertParentsSearchable(dir: string) {
  let cur = path.resolve(dir);
  while (true) {
    const res = spawnSync('runuser', ['-u', RUN_AS, '--', 'test', '-x', cur]);
    if (res.status !== 0) {
      throw new Error(
        `PostgreSQL runs as the unprivileged user "${RUN_AS}", which cannot enter ${cur}. ` +
          `Make it searchable (chmod o+x ${cur}) or set TILLWELL_PG_DIR to a folder elsewhere, e.g. under /var/tmp.`,
      );
    }
    const up = path.dirname(cur);
    if (up === cur) break;
    cur = up;
  }
}

/** Removes a throwaway cluster's folder (it belongs to the postgres user when run as root). */
export function removeDir(dir: string) {
  fs.rmSync(dir, { recursive: true, force: true });
}
