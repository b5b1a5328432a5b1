import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { inject } from 'vitest';
import { freePort } from '../../scripts/lib/postgres';

const root = path.resolve(import.meta.dirname, '..', '..');
const READY = /Tillwell is serving on (http:\/\/\S+)/;

/** The secret every server of a test shares, as servers behind one load balancer would (32+ characters, server/config.ts). */
export const SHARED_SESSION_SECRET = 'faults-test-session-secret-0123456789abcdef';

export interface ServerProcess {
  readonly url: string;
  readonly port: number;
  readonly child: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far (for failure messages). */
  output(): string;
  /** SIGTERM (the server's own graceful stop), then SIGKILL after `graceMs`; resolves when the process has exited. */
  stop(graceMs?: number): Promise<void>;
  /** SIGKILL at once, as a crash or the OOM killer would; resolves when the process has exited. */
  kill(): Promise<void>;
}

const running = new Set<ChildProcess>();

// A last guard if the test runner exits without afterAll (a crash): no server is left behind.
process.once('exit', () => {
  for (const child of running) child.kill('SIGKILL');
});

const exited = (child: ChildProcess) =>
  child.exitCode !== null || child.signalCode !== null
    ? Promise.resolve()
    : new Promise<void>((resolve) => child.once('exit', () => resolve()));

/**
 * Starts `server/index.ts` (the production entry) as its own Node process on a free port against
 * the test database and fake inbox, and waits for its "serving" line. The process is node itself
 * with tsx as a loader (not `npx tsx`, whose wrapper would take a signal meant for the server).
 */
export async function startServerProcess(env: Record<string, string> = {}, opts: { port?: number; timeoutMs?: number } = {}): Promise<ServerProcess> {
  const port = opts.port ?? (await freePort());
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      PATH: process.env.PATH ?? '/usr/bin:/bin',
      HOME: process.env.HOME ?? '/tmp',
      NODE_ENV: 'test',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: inject('databaseUrl'),
      SMTP_URL: inject('smtpUrl'),
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      SESSION_SECRET: SHARED_SESSION_SECRET,
      BCRYPT_COST: '10',
      AUTH_RATE_LIMIT: '1000',
      SIGNIN_MAX_FAILURES_PER_ADDRESS: '1000',
      LOG_LEVEL: 'warn',
      STATIC_DIR: '/nonexistent',
      UPLOAD_DIR: inject('uploadDir'),
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  running.add(child);
  child.once('exit', () => running.delete(child));
  let log = '';
  child.stdout!.setEncoding('utf8').on('data', (d: string) => (log += d));
  child.stderr!.setEncoding('utf8').on('data', (d: string) => (log += d));

  const timeoutMs = opts.timeoutMs ?? 90_000;
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => fail(new Error(`server on port ${port} did not start within ${timeoutMs} ms:\n${log}`)), timeoutMs);
    const onData = () => {
      const m = READY.exec(log);
      if (m) done(m[1]);
    };
    const onExit = (code: number | null, signal: string | null) => fail(new Error(`server on port ${port} exited (${code ?? signal}) before it served:\n${log}`));
    const cleanup = () => {
      clearTimeout(timer);
      child.stdout!.off('data', onData);
      child.off('exit', onExit);
    };
    const done = (u: string) => {
      cleanup();
      resolve(u);
    };
    const fail = (err: Error) => {
      cleanup();
      child.kill('SIGKILL');
      reject(err);
    };
    child.stdout!.on('data', onData);
    child.once('exit', onExit);
  });

  return {
    url,
    port,
    child,
    output: () => log,
    async stop(graceMs = 15_000) {
      if (child.exitCode !== null || child.signalCode !== null) return;
      const gone = exited(child);
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
      await gone;
      clearTimeout(timer);
    },
    async kill() {
      const gone = exited(child);
      child.kill('SIGKILL');
      await gone;
    },
  };
}

/** Stops every server process this file started that is still running (for afterAll; never throws). */
export async function stopAllServerProcesses(): Promise<void> {
  await Promise.all(
    [...running].map(async (child) => {
      const gone = exited(child);
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 15_000);
      await gone;
      clearTimeout(timer);
    }),
  );
}

/** The pids of processes still running that this file started (a test checks it is empty after stopping). */
export const runningServerPids = () => [...running].map((c) => c.pid);

/** The parts of JSON answers these tests read (left out when an answer has no such field). */
export interface ApiBody {
  id?: number;
  csrfToken?: string;
  user?: { id: number; email: string } | null;
  state?: string;
  season?: { id: number };
  plantings?: Array<{ id: number }>;
  error?: { code: string; message: string; fields?: Record<string, string> };
}

export interface Answer {
  status: number;
  body: ApiBody;
  headers: Headers;
}

/**
 * A client that keeps cookies by name and sends them to whichever server it calls, as a browser
 * does for one site behind a load balancer (cookies are not scoped by port), with the CSRF token.
 */
export class CookieClient {
  private readonly cookies = new Map<string, string>();
  csrf = '';
  /** The client address it says it is behind the proxy (TRUST_PROXY=true), so rate limits see distinct clients. */
  constructor(private readonly forwardedFor?: string) {}

  cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async request(base: string, method: string, pathname: string, body?: unknown): Promise<Answer> {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (this.cookies.size) headers.Cookie = this.cookieHeader();
    if (method !== 'GET') headers['X-CSRF-Token'] = this.csrf;
    if (body !== undefined) headers['Content-Type'] = 'application/json';
    if (this.forwardedFor) headers['X-Forwarded-For'] = this.forwardedFor;
    const res = await fetch(`${base}${pathname}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      if (/expires=Thu, 01 Jan 1970/i.test(line) || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await res.text();
    let parsed: ApiBody | null = null;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON (no test reads such a body): an empty one
    }
    return { status: res.status, body: parsed ?? {}, headers: res.headers };
  }

  /** GET /api/session on `base`: keeps the CSRF token and returns the session's user (null when signed out). */
  async session(base: string) {
    const r = await this.request(base, 'GET', '/api/session');
    if (r.status !== 200) throw new Error(`GET /api/session answered ${r.status}: ${JSON.stringify(r.body)}`);
    this.csrf = r.body.csrfToken ?? '';
    return r.body.user ?? null;
  }

  async signIn(base: string, email: string, password: string) {
    if (!this.csrf) await this.session(base);
    const r = await this.request(base, 'POST', '/api/session', { email, password });
    if (r.status === 200) this.csrf = r.body.csrfToken ?? '';
    return r;
  }

  get = (base: string, p: string) => this.request(base, 'GET', p);
  post = (base: string, p: string, body?: unknown) => this.request(base, 'POST', p, body);
  delete = (base: string, p: string) => this.request(base, 'DELETE', p);
}
