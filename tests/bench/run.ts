import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { findOverlaps, firstOverlaps, neighbours, type PlacedRect } from '@shared/geometry';
import { loadConfig } from '../../server/config';
import { createDb } from '../../server/db/knex';
import { startServer } from '../../server/start-server';
import { freePort, removeDir, startCluster } from '../../scripts/lib/postgres';
import autocannon from 'autocannon';
import type { Knex } from 'knex';
import { recheckEverything, recheckSite } from '../../server/services/findings';
import { loadReferenceCrops } from '../../server/services/reference-crops';
import { generateSiteTasks } from '../../server/services/tasks';
import { newToken } from '../../server/services/tokens';
import { buildNetwork, progressBar } from './network';

// `npm run bench`: speed targets live here, never in timed tests. Prints medians and checks
// them against the targets, exiting non-zero when one is missed.

const targets: Array<{ name: string; ms: number; targetMs: number; unit?: string }> = [];
/** Printed figures beside the targets, for the results file. */
const figures: string[] = [];
function say(line: string) {
  console.log(line);
  figures.push(line);
}

// `npm run bench -- --only=map,storm` runs some parts: unit, map, storm, city (all by default).
const onlyArg = process.argv.find((a) => a.startsWith('--only='));
const parts = new Set(onlyArg ? onlyArg.slice('--only='.length).split(',') : ['unit', 'map', 'storm', 'city']);

function median(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function time(name: string, runs: number, targetMs: number, fn: () => unknown) {
  const xs: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    xs.push(performance.now() - t0);
  }
  targets.push({ name, ms: median(xs), targetMs });
}

/** A garden grid of n plots, 3 × 6 m with 0.9 m paths. */
function grid(n: number): PlacedRect<number>[] {
  const perRow = 25;
  return Array.from({ length: n }, (_, i) => ({
    id: i + 1,
    x: (i % perRow) * 3.9,
    y: Math.floor(i / perRow) * 6.9,
    width: 3,
    length: 6,
    rotation: 0 as const,
  }));
}

const g500 = grid(500);
const g2000 = grid(2000);
if (parts.has('unit')) {
time('neighbours(), 500 plots', 21, 50, () => neighbours(g500, 0.9));
time('neighbours(), 2000 plots', 11, 200, () => neighbours(g2000, 0.9));
time('findOverlaps(), 2000 plots', 11, 200, () => findOverlaps(g2000));
// An import's overlap check: a clean 2,000-plot file, and 2,000 rows all on one spot (was 13 s with every pair reported).
const pile = Array.from({ length: 2000 }, () => ({ x: 1, y: 1, width: 3, length: 6, rotation: 0 as const }));
time('firstOverlaps(), 2000 plots in a grid', 11, 50, () => firstOverlaps(g2000));
time('firstOverlaps(), 2000 plots on one spot', 11, 100, () => firstOverlaps(pile));
}

// The map's two reads over HTTP, for a site of 500 plots, on a throwaway cluster.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-bench-'));
fs.chmodSync(dir, 0o755);
const cluster = startCluster({ dataDir: path.join(dir, 'data'), port: await freePort(), throwaway: true, log: () => {} });
try {
  await cluster.createDatabase('bench');
  const port = await freePort();
  // The claim storm's 200 people come from one address here; in use each has their own, so the
  // per-address limit on link pages (30 in 15 minutes by default) is raised for this server only.
  const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: cluster.url('bench'), PORT: String(port), LOG_LEVEL: 'silent', STATIC_DIR: '/nonexistent', SMTP_URL: 'smtp://127.0.0.1:1', AUTH_RATE_LIMIT: '1000' });
  const server = await startServer(config);
  const db = createDb(config.databaseUrl);
  const [club] = await db('clubs').insert({ name: 'Bench club', slug: 'bench' }).returning('id');
  const [site] = await db('sites')
    .insert({ club_id: club.id, name: 'Big field', latitude: 51, longitude: 0, time_zone: 'UTC', width_m: 100, length_m: 200 })
    .returning('id');
  await db('plots').insert(g500.map((p) => ({ site_id: site.id, label: `P-${p.id}`, x_m: p.x, y_m: p.y, width_m: 3, length_m: 6 })));
  const [season] = await db('seasons').insert({ club_id: club.id, year: new Date().getUTCFullYear() }).returning('id');
  const bcrypt = (await import('bcryptjs')).default;
  const [user] = await db('users').insert({ email: 'b@example.org', name: 'B', password_hash: bcrypt.hashSync('bench-password-1', 10) }).returning('id');
  await db('memberships').insert({ club_id: club.id, user_id: user.id, role: 'coordinator' });
  const { cookie } = await signIn(server.url, 'b@example.org', 'bench-password-1');
  if (parts.has('map')) {
    const demo = await demoServer(cluster);
    try {
      await benchMapReads([
        { name: 'demo site: GET /api/sites/:id/plots', url: `${demo.url}/api/sites/${demo.siteId}/plots`, cookie: demo.cookie, ratio: 0.25, p99: 50 },
        { name: 'demo site: GET /api/seasons/:id/plot-states', url: `${demo.url}/api/seasons/${demo.seasonId}/plot-states?siteId=${demo.siteId}`, cookie: demo.cookie, ratio: 0.25, p99: 50 },
        { name: 'demo site: GET /api/sites/:id/findings', url: `${demo.url}/api/sites/${demo.siteId}/findings`, cookie: demo.cookie, ratio: 0.25, p99: 50 },
        { name: 'demo club: GET /api/clubs/:id/shifts (board)', url: `${demo.url}/api/clubs/${demo.clubId}/shifts`, cookie: demo.cookie, ratio: 0.25, p99: 50 },
        { name: '500 plots: GET /api/sites/:id/plots', url: `${server.url}/api/sites/${site.id}/plots`, cookie, ratio: 0.1 },
        { name: '500 plots: GET /api/sites/:id/neighbours', url: `${server.url}/api/sites/${site.id}/neighbours`, cookie, ratio: 0.1 },
        { name: '500 plots: GET /api/seasons/:id/plot-states', url: `${server.url}/api/seasons/${season.id}/plot-states?siteId=${site.id}`, cookie, ratio: 0.1 },
      ]);
    } finally {
      await demo.stop();
    }
  }
  if (parts.has('storm')) await benchClaimStorm(db, server.url, club.id, site.id);
  await settle();
  await db.destroy();
  await server.stop();

  if (parts.has('city')) await benchNeighbourCheck(cluster);
} finally {
  cluster.stop();
  removeDir(dir);
}

/** Lets requests a load run left in flight finish before a server stops (else their pool waits are aborted noisily). */
function settle() {
  return new Promise((resolve) => setTimeout(resolve, 1000));
}

/** Signs in over HTTP and answers the session cookie and CSRF token. */
async function signIn(url: string, email: string, password: string) {
  const s0 = await fetch(`${url}/api/session`);
  let cookie = s0.headers.get('set-cookie')!.split(';')[0];
  const { csrfToken } = await s0.json();
  const res = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in ${res.status}`);
  cookie = res.headers.get('set-cookie')!.split(';')[0];
  const fresh = await (await fetch(`${url}/api/session`, { headers: { cookie } })).json();
  return { cookie, csrfToken: (fresh.csrfToken as string) ?? csrfToken };
}

/** One planting changed and its plot re-checked, in one transaction, as the planting routes do. */
async function singleChange(db: Knex, probe: { siteId: number; plotId: number; plantingId: number }, crops: number[], runs: number): Promise<number> {
  const xs: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await db.transaction(async (trx) => {
      await trx('plantings').where({ id: probe.plantingId }).update({ crop_id: crops[i % crops.length] });
      await recheckSite(trx, probe.siteId, [probe.plotId]);
    });
    xs.push(performance.now() - t0);
  }
  return median(xs);
}

/**
 * The neighbour check on synthetic networks in their own databases: 100 plots on one site, and
 * 10,000 plots on 50 sites, each with five seasons of plantings.
 */
async function benchNeighbourCheck(cluster: ReturnType<typeof startCluster>) {
  const YEAR = new Date().getUTCFullYear();
  const results: Record<string, number> = {};
  for (const [name, sites, perSite] of [['net100', 1, 100], ['net10k', 50, 200]] as const) {
    await cluster.createDatabase(name);
    const port = await freePort();
    const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: cluster.url(name), PORT: String(port), LOG_LEVEL: 'silent', STATIC_DIR: '/nonexistent', SMTP_URL: 'smtp://127.0.0.1:1' });
    const server = name === 'net10k' ? await startServer(config) : null;
    const db = createDb(config.databaseUrl);
    try {
      if (!server) {
        await db.migrate.latest();
        await loadReferenceCrops(db);
      }
      const t00 = performance.now();
      const net = await buildNetwork(db, {
        sites, plotsPerSite: perSite, seasons: 5, year: YEAR, onProgress: progressBar(`Building ${sites * perSite} plots`),
        people: name === 'net10k' ? { volunteers: 2000 } : undefined,
      });
      if (name === 'net10k') {
        say(`city network built in ${((performance.now() - t00) / 1000).toFixed(0)} s: ${sites} sites, ${net.plots} plots, ${net.plantings} plantings, ${net.allocations} allocations over 5 seasons, ${net.users} people (2,000 volunteers), ${net.shifts} shifts, ${net.claims} places taken`);
      }
      const t0 = performance.now();
      await recheckEverything(db);
      const full = performance.now() - t0;
      const [{ n }] = await db('findings').count({ n: '*' });
      say(`${name}: ${net.plots} plots, ${net.plantings} plantings, ${n} findings stored by the full check in ${(full / 1000).toFixed(2)} s`);
      if (name === 'net10k') targets.push({ name: 'full neighbour check, 10,000 plots, 5 seasons', ms: full, targetMs: 120_000 });
      if (name === 'net10k') await benchTaskGeneration(db, net.clubId, YEAR);
      const crops = (await db('crops').whereNull('club_id').whereIn('slug', ['potato', 'radish', 'tomato', 'pea']).select('id')).map((c: { id: number }) => c.id);
      results[name] = await singleChange(db, net.probe, crops, 31);
      targets.push({ name: `single-change re-check, ${net.plots.toLocaleString('en')} plots`, ms: results[name], targetMs: 100 });

      if (server) {
        const bcrypt = (await import('bcryptjs')).default;
        const [user] = await db('users').insert({ email: 'net@example.org', name: 'N', password_hash: bcrypt.hashSync('bench-password-1', 10) }).returning('id');
        await db('memberships').insert({ club_id: net.clubId, user_id: user.id, role: 'coordinator' });
        const { cookie, csrfToken } = await signIn(server.url, 'net@example.org', 'bench-password-1');
        const body = JSON.stringify({ cropId: crops[2], method: 'transplanted', plantedOn: `${YEAR}-05-20`, plantingId: null });
        const probeRes = await fetch(`${server.url}/api/plots/${net.probe.plotId}/plantings/check`, { method: 'POST', headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' }, body });
        if (probeRes.status !== 200) throw new Error(`dry run answered ${probeRes.status}: ${await probeRes.text()}`);
        const result = await autocannon({
          url: `${server.url}/api/plots/${net.probe.plotId}/plantings/check`,
          method: 'POST',
          connections: 20,
          duration: 10,
          headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
          body,
        });
        const bad = result.non2xx + result.errors;
        say(`dry run over HTTP, 20 connections, 10 s: ${result.requests.average.toFixed(0)} requests/s, p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, ${bad} not 2xx`);
        if (bad > 0) throw new Error(`${bad} dry runs failed`);
        targets.push({ name: 'planting dry run p99, 20 connections, 10,000 plots', ms: result.latency.p99, targetMs: 50, unit: 'ms' });
        await benchSignIn(server.url, db, net.clubId);
      }
    } finally {
      await db.destroy();
      await server?.stop();
    }
  }
  targets.push({ name: 'single-change re-check, 10,000 plots ÷ 100 plots', ms: results.net10k / results.net100, targetMs: 1.5, unit: '×' });
}

/**
 * Task generation over every site of the 10,000-plot network, as on a day in May of its newest season:
 * a first run, then a run with nothing changed, which must write nothing (counted by the service and by
 * a digest of every task row's xmin).
 */
async function benchTaskGeneration(db: Knex, clubId: number, year: number) {
  const sites: number[] = (await db('sites').where({ club_id: clubId }).orderBy('id').select('id')).map((r: { id: number }) => r.id);
  const now = new Date(`${year}-05-15T06:00:00Z`);
  const runAll = async () => {
    const t0 = performance.now();
    const sum = { created: 0, updated: 0, removed: 0, total: 0 };
    const bar = progressBar(`Generating tasks on ${sites.length} sites`);
    for (const [i, id] of sites.entries()) {
      const r = await generateSiteTasks(db, id, { now });
      sum.created += r.created;
      sum.updated += r.updated;
      sum.removed += r.removed;
      sum.total += r.total;
      bar(i + 1, sites.length);
    }
    return { ms: performance.now() - t0, ...sum };
  };
  // Every row's id and physical version: any insert, update or delete changes the digest.
  const digest = async () => (await db.raw("select count(*)::int as n, md5(coalesce(string_agg(id::text || ':' || xmin::text, ',' order by id), '')) as d from tasks")).rows[0];
  const first = await runAll();
  say(`task generation, first run: ${first.total} plantings, ${first.created} tasks in ${(first.ms / 1000).toFixed(1)} s`);
  targets.push({ name: 'task generation, first run, 10,000 plots', ms: first.ms, targetMs: 120_000 });
  const before = await digest();
  const again = await runAll();
  const after = await digest();
  const written = again.created + again.updated + again.removed;
  const same = before.n === after.n && before.d === after.d;
  say(`task generation, no change: ${(again.ms / 1000).toFixed(1)} s, ${written} rows written by the service's count, rows ${same ? 'unchanged' : 'CHANGED'} by their xmin`);
  targets.push({ name: 'task generation, no-change run, 10,000 plots', ms: again.ms, targetMs: 60_000 });
  targets.push({ name: 'task generation, no-change run: rows written', ms: written + (same ? 0 : 1), targetMs: 0, unit: 'rows' });
}

/** The demo data (the seeds `npm start` loads) in its own database, with a server on it and the coordinator signed in. */
async function demoServer(cluster: ReturnType<typeof startCluster>) {
  await cluster.createDatabase('demo');
  const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: cluster.url('demo'), PORT: String(await freePort()), LOG_LEVEL: 'silent', STATIC_DIR: '/nonexistent', SMTP_URL: 'smtp://127.0.0.1:1' });
  const server = await startServer(config);
  const db = createDb(config.databaseUrl);
  await db.seed.run();
  await loadReferenceCrops(db);
  // The demo's biggest site and the coordinator of its club (seeds/01-demo-club.ts).
  const site = await db('plots').whereNull('deleted_at').groupBy('site_id').orderByRaw('count(*) desc').first('site_id', db.raw('count(*)::int as n'));
  const { club_id: clubId } = await db('sites').where({ id: site.site_id }).first('club_id');
  const season = await db('seasons').where({ club_id: clubId }).orderBy('year', 'desc').first('id');
  const { DEMO_PASSWORD } = await import('../../seeds/01-demo-club');
  const { cookie } = await signIn(server.url, 'maren@example.org', DEMO_PASSWORD);
  say(`demo data: site ${site.site_id} with ${site.n} plots, season ${season.id}`);
  return {
    url: server.url,
    cookie,
    clubId: clubId as number,
    siteId: site.site_id as number,
    seasonId: season.id as number,
    async stop() {
      await settle();
      await db.destroy();
      await server.stop();
    },
  };
}

/**
 * Reads under load beside a bare Express route answering a small JSON object, in the same process
 * and run, 50 connections for 5 s each after 2 s of warm-up (the JIT settles): the ratio of
 * requests/s to the bare route's holds on a noisy machine. Each read has a ratio to reach and, for
 * the demo-sized ones, a p99 under 50 ms.
 */
async function benchMapReads(reads: Array<{ name: string; url: string; cookie: string; ratio: number; p99?: number }>) {
  const express = (await import('express')).default;
  const bare = express();
  bare.get('/bare', (_req, res) => {
    res.json({ ok: true, name: 'bare', n: 1 });
  });
  const port = await freePort();
  const listening = await new Promise<import('node:http').Server>((resolve) => {
    const srv = bare.listen(port, '127.0.0.1', () => resolve(srv));
  });
  const load = async (target: string, headers: Record<string, string> = {}) => {
    await autocannon({ url: target, connections: 50, duration: 2, headers });
    const r = await autocannon({ url: target, connections: 50, duration: 5, headers });
    if (r.non2xx + r.errors > 0) throw new Error(`${target}: ${r.non2xx} non-2xx, ${r.errors} errors`);
    return { rps: r.requests.average, p99: r.latency.p99 };
  };
  try {
    const base = await load(`http://127.0.0.1:${port}/bare`);
    say(`bare Express route, 50 connections: ${base.rps.toFixed(0)} requests/s, p99 ${base.p99} ms`);
    for (const read of reads) {
      const r = await load(read.url, { cookie: read.cookie });
      const share = r.rps / base.rps;
      say(`${read.name}, 50 connections: ${r.rps.toFixed(0)} requests/s (${share.toFixed(2)} of bare), p99 ${r.p99} ms`);
      // Stored as "short by": the share below its target (0 when met).
      targets.push({ name: `${read.name}: share of bare below ${read.ratio}`, ms: Math.max(0, read.ratio - share), targetMs: 0, unit: 'short' });
      if (read.p99) targets.push({ name: `${read.name}: p99`, ms: r.p99, targetMs: read.p99, unit: 'ms' });
    }
  } finally {
    await new Promise((resolve) => listening.close(resolve));
  }
}

/**
 * Sign-in on the city network (12,000 people): one at a time, and 20 people at once, each with
 * their own account, at the product's password hashing cost (bcrypt, BCRYPT_COST default 12).
 */
async function benchSignIn(url: string, db: Knex, clubId: number) {
  const bcrypt = (await import('bcryptjs')).default;
  const hash = bcrypt.hashSync('bench-password-2', 12);
  const people = await db('users').insert(Array.from({ length: 20 }, (_, i) => ({ email: `signin-${i}@example.org`, name: `Sign-in ${i}`, password_hash: hash }))).returning('id');
  await db('memberships').insert(people.map((p: { id: number }) => ({ club_id: clubId, user_id: p.id, role: 'plot_holder' })));
  const once = async (i: number) => {
    const t0 = performance.now();
    await signIn(url, `signin-${i}@example.org`, 'bench-password-2');
    return performance.now() - t0;
  };
  const alone: number[] = [];
  for (let i = 0; i < 7; i++) alone.push(await once(i % 20));
  const together = (await Promise.all(Array.from({ length: 20 }, (_, i) => once(i)))).sort((a, b) => a - b);
  say(`sign-in: one at a time median ${median(alone).toFixed(0)} ms; 20 at once slowest ${together[19].toFixed(0)} ms`);
  targets.push({ name: 'sign-in, one at a time, 12,000 people', ms: median(alone), targetMs: 1000 });
  targets.push({ name: 'sign-in, 20 at once: slowest', ms: together[19], targetMs: 10_000, unit: 'ms' });
}

/**
 * A claim storm: 200 volunteers confirm their e-mailed links at once over HTTP, 20 on each of 10
 * shifts of 3 places. Exactly 3 places per shift may be taken, and nothing may answer 5xx.
 */
async function benchClaimStorm(db: Knex, url: string, clubId: number, siteId: number) {
  const startsAt = new Date(Date.now() + 2 * 86_400_000);
  const day = startsAt.toISOString().slice(0, 10);
  const shifts: number[] = [];
  for (let i = 0; i < 10; i++) {
    const [row] = await db('shifts')
      .insert({ club_id: clubId, site_id: siteId, title: `Storm ${i + 1}`, kind: 'water', on_date: day, start_time: '18:00', end_time: '19:00', starts_at: startsAt, ends_at: new Date(startsAt.getTime() + 3_600_000), capacity: 3, est_hours: 1 })
      .returning('id');
    shifts.push(row.id);
  }
  const people = await db('users')
    .insert(Array.from({ length: 200 }, (_, i) => ({ email: `storm${i}@example.org`, name: `Storm ${i}` })))
    .returning('id');
  await db('memberships').insert(people.map((p: { id: number }) => ({ club_id: clubId, user_id: p.id, role: 'volunteer' })));
  const tokens = people.map((p: { id: number }, i: number) => ({ shiftId: shifts[i % 10], userId: p.id, ...newToken() }));
  await db('shift_links').insert(tokens.map((t) => ({ shift_id: t.shiftId, user_id: t.userId, purpose: 'claim', token_hash: t.hash, expires_at: startsAt })));
  const s0 = await fetch(`${url}/api/session`);
  const cookie = s0.headers.get('set-cookie')!.split(';')[0];
  const { csrfToken } = await s0.json();
  const latencies: number[] = [];
  const statuses = await Promise.all(
    tokens.map(async (t) => {
      const t0 = performance.now();
      const r = await fetch(`${url}/api/shift-links/claim`, { method: 'POST', headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' }, body: JSON.stringify({ token: t.token }) });
      await r.arrayBuffer();
      latencies.push(performance.now() - t0);
      return r.status;
    }),
  );
  latencies.sort((a, b) => a - b);
  const p99 = latencies[Math.ceil(latencies.length * 0.99) - 1];
  const count = (pred: (s: number) => boolean) => statuses.filter(pred).length;
  const perShift = await db('shift_claims').whereIn('shift_id', shifts).where({ status: 'taken' }).groupBy('shift_id').select('shift_id', db.raw('count(*)::int as n'));
  const exact = perShift.length === 10 && perShift.every((r: { n: number }) => r.n === 3);
  say(
    `claim storm: 200 claims at once on 10 shifts of 3 places: ${count((s) => s === 200)} taken, ${count((s) => s === 409)} told "already covered", ${count((s) => s >= 500)} 5xx; ` +
      `${exact ? 'exactly 3 per shift' : `per shift ${JSON.stringify(perShift)}`}; p50 ${latencies[99].toFixed(0)} ms, p99 ${p99.toFixed(0)} ms`,
  );
  targets.push({ name: 'claim storm: 5xx answers', ms: count((s) => s >= 500), targetMs: 0, unit: 'answers' });
  targets.push({ name: 'claim storm: shifts not at exactly 3 places', ms: exact ? 0 : 10 - perShift.filter((r: { n: number }) => r.n === 3).length, targetMs: 0, unit: 'shifts' });
}

let missed = 0;
for (const t of targets) {
  const ok = t.ms <= t.targetMs;
  if (!ok) missed++;
  const unit = t.unit ?? 'ms';
  const what = t.unit ? '      ' : 'median';
  console.log(`${ok ? 'ok  ' : 'MISS'} ${t.name.padEnd(58)} ${what} ${t.ms.toFixed(2).padStart(9)} ${unit}  (target ≤ ${t.targetMs} ${unit})`);
}
process.exitCode = missed ? 1 : 0;

// The latest figures, with the machine they ran on, in a git-ignored file (bench-results/).
const machine = `${os.cpus().length} × ${os.cpus()[0]?.model.trim() ?? 'unknown CPU'}, ${(os.totalmem() / 2 ** 30).toFixed(1)} GB, Node ${process.version}, ${os.type()} ${os.release()}`;
const outDir = path.join(import.meta.dirname, '..', '..', 'bench-results');
fs.mkdirSync(outDir, { recursive: true });
const rows = targets.map((t) => `| ${t.name} | ${t.ms.toFixed(2)} ${t.unit ?? 'ms'} | ≤ ${t.targetMs} ${t.unit ?? 'ms'} | ${t.ms <= t.targetMs ? 'met' : 'not met'} |`);
fs.writeFileSync(
  path.join(outDir, 'latest.md'),
  [`# npm run bench, ${new Date().toISOString()}`, '', `Machine: ${machine}`, `Parts: ${[...parts].join(', ')}`, '', ...figures.map((f) => `- ${f}`), '', '| Figure | Measured | Target | |', '|---|---|---|---|', ...rows, ''].join('\n'),
);
fs.writeFileSync(path.join(outDir, 'latest.json'), JSON.stringify({ at: new Date().toISOString(), machine, parts: [...parts], figures, targets }, null, 2));
console.log(`${missed} of ${targets.length} targets missed; figures written to bench-results/latest.md (machine: ${machine})`);
