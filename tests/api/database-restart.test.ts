import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, removeDir, startCluster, type Cluster } from '../../scripts/lib/postgres';
import { createDb } from '../../server/db/knex';
import { startServer, type RunningServer } from '../../server/start-server';
import { buildClub, buildMember } from '../factories';
import { testConfig } from '../helpers/app';

// A running server whose PostgreSQL goes away and comes back: the process stays up, requests
// answer 503 with the error shape meanwhile, and succeed again afterwards with no restart.
// This file runs its own cluster so stopping it leaves the other tests' database alone.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-restart-pg-'));
fs.chmodSync(dir, 0o755);
let cluster: Cluster;
let server: RunningServer;
let port: number;
let clubId: number;

async function call(pathname: string, init: RequestInit = {}, cookie = '') {
  const res = await fetch(`${server.url}${pathname}`, {
    ...init,
    headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}), ...(init.headers ?? {}) },
  });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null, headers: res.headers };
}

async function signIn() {
  const first = await call('/api/session');
  const cookie = (first.headers.get('set-cookie') ?? '').split(';')[0];
  const res = await call(
    '/api/session',
    {
      method: 'POST',
      headers: { 'x-csrf-token': first.body.csrfToken },
      body: JSON.stringify({ email: 'rhea@example.org', password: 'a long enough password' }),
    },
    cookie,
  );
  expect(res.status).toBe(200);
  return (res.headers.get('set-cookie') ?? cookie).split(';')[0];
}

async function until<T>(what: () => Promise<T>, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  let last = await what();
  while (!ok(last) && Date.now() < end) {
    await new Promise((r) => setTimeout(r, 100));
    last = await what();
  }
  return last;
}

describe('a database restart under a running server', () => {
  beforeAll(async () => {
    port = await freePort();
    cluster = startCluster({ dataDir: path.join(dir, 'data'), port, throwaway: true, log: () => {} });
    await cluster.createDatabase('restart_test');
    const databaseUrl = cluster.url('restart_test');
    const db = createDb(databaseUrl);
    try {
      await db.migrate.latest();
      const club = await buildClub(db, { name: 'Restart Club' });
      clubId = club.id;
      await buildMember(db, { clubId, roles: ['coordinator'], user: { email: 'rhea@example.org', password: 'a long enough password' } });
    } finally {
      await db.destroy();
    }
    const appPort = await freePort();
    server = await startServer(testConfig({ DATABASE_URL: databaseUrl, PORT: String(appPort), PUBLIC_URL: `http://127.0.0.1:${appPort}` }));
  });

  afterAll(async () => {
    await server?.stop();
    cluster?.stop();
    removeDir(dir);
  });

  it('answers 503 while PostgreSQL is away and recovers by itself when it returns', async () => {
    const cookie = await signIn();
    const before = await call('/api/session', {}, cookie);
    expect(before.status).toBe(200);
    expect(before.body.user.email).toBe('rhea@example.org');

    cluster.stop();
    // Give the pools time to see their idle connections die (the crash came within ~60 ms).
    await new Promise((r) => setTimeout(r, 1500));

    for (const url of ['/api/session', `/api/clubs/${clubId}/members`]) {
      const away = await call(url, {}, cookie);
      expect(away.status, url).toBe(503);
      expect(away.body.error.code).toBe('unavailable');
      expect(away.body.error.message).toMatch(/database/i);
      expect(away.headers.get('retry-after')).toBe('5');
    }
    // An anonymous request that needs the database is refused the same way.
    const anon = await call(`/api/clubs/${clubId}/members`);
    expect([401, 503]).toContain(anon.status);

    cluster = startCluster({ dataDir: path.join(dir, 'data'), port, throwaway: true, log: () => {} });
    const back = await until(() => call('/api/session', {}, cookie), (r) => r.status === 200);
    expect(back.status).toBe(200);
    expect(back.body.user.email).toBe('rhea@example.org');
    const clubs = await until(() => call(`/api/clubs/${clubId}/members`, {}, cookie), (r) => r.status === 200);
    expect(clubs.status).toBe(200);
  }, 60_000);
});
