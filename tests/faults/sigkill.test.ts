import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { checkPlots } from '@shared/findings';
import { addCalendarDays, localToday } from '@shared/dates';
import { createDb } from '../../server/db/knex';
import { loadCheckContext } from '../../server/services/findings';
import { regenerateTasks } from '../../server/services/tasks';
import { newToken } from '../../server/services/tokens';
import { buildClub, buildCrop, buildMember } from '../factories';
import { truncateAll } from '../helpers/app';
import { CookieClient, runningServerPids, type Answer, type ApiBody, startServerProcess, stopAllServerProcesses, type ServerProcess } from '../helpers/server-process';

// One real server process takes a burst of place claims and planting saves and is killed with
// SIGKILL in the middle (no graceful stop: open transactions die with their connections). After a
// restart, everything it acknowledged is there, and nothing it was doing is there by halves.

const db = createDb(inject('databaseUrl'));
const YEAR = Number(localToday('UTC').slice(0, 4));
const SHIFTS = 4;
const CAPACITY = 4;
const LINKS_PER_SHIFT = 10;
const PLANTINGS = 40;
/** The process is killed once this many writes were acknowledged (2xx received), while later ones are still being written. */
const KILL_AFTER_ACKS = 6;
const STAGGER_MS = 40;

let server: ServerProcess;
let port = 0;

interface Setup {
  clubId: number;
  siteId: number;
  plotId: number;
  seasonId: number;
  onionId: number;
  shiftIds: number[];
  links: Array<{ token: string; shiftId: number; userId: number }>;
  holder: { email: string; password: string };
}
let s: Setup;

beforeAll(async () => {
  await truncateAll(db);
  const club = await buildClub(db, { name: 'Crash Lane Growers' });
  // The test site's own frost dates (inputs, not facts of the trade).
  const [site] = await db('sites')
    .insert({ club_id: club.id, name: 'Crash field', latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20, last_spring_frost: '04-25', first_autumn_frost: '10-15' })
    .returning('id');
  const [plot] = await db('plots').insert({ site_id: site.id, label: 'K-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [last] = await db('seasons').insert({ club_id: club.id, year: YEAR - 1 }).returning('id');
  const [season] = await db('seasons').insert({ club_id: club.id, year: YEAR }).returning('id');
  const holder = await buildMember(db, { clubId: club.id, roles: ['plot_holder'] });
  await db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.id, source: 'manual' });
  const onion = await buildCrop(db, 'onion');
  // Onions last year on the plot: onions again this year are a rotation finding, written with each planting.
  await db('plantings').insert({ plot_id: plot.id, season_id: last.id, crop_id: onion.id, method: 'transplanted', planted_on: `${YEAR - 1}-05-01` });
  const day = addCalendarDays(localToday('UTC'), 3);
  const startsAt = new Date(`${day}T18:00:00Z`);
  const shiftIds: number[] = [];
  const links: Setup['links'] = [];
  for (let k = 0; k < SHIFTS; k++) {
    const [shift] = await db('shifts')
      .insert({
        club_id: club.id, site_id: site.id, title: `Crash shift ${k}`, kind: 'water', on_date: day, start_time: '18:00', end_time: '19:00',
        starts_at: startsAt, ends_at: new Date(startsAt.getTime() + 3_600_000), capacity: CAPACITY, est_hours: 1, instructions: '', created_by_user_id: holder.id,
      })
      .returning('id');
    shiftIds.push(shift.id);
    for (let i = 0; i < LINKS_PER_SHIFT; i++) {
      const v = await buildMember(db, { clubId: club.id, roles: ['volunteer'] });
      const { token, hash } = newToken();
      await db('shift_links').insert({ shift_id: shift.id, user_id: v.id, purpose: 'claim', token_hash: hash, expires_at: startsAt });
      links.push({ token, shiftId: shift.id, userId: v.id });
    }
  }
  s = { clubId: club.id, siteId: site.id, plotId: plot.id, seasonId: season.id, onionId: onion.id, shiftIds, links, holder: { email: holder.email, password: holder.password! } };
  server = await startServerProcess();
  port = server.port;
}, 200_000);

afterAll(async () => {
  await stopAllServerProcesses();
  await db.destroy();
  expect(runningServerPids()).toEqual([]);
}, 60_000);

// Sown a few days ago, so its care tasks are still ahead and are written with it.
const plantedOn = addCalendarDays(localToday('UTC'), -5);
const planting = (i: number) => ({
  cropId: s.onionId,
  variety: `Burst ${i}`,
  part: null,
  method: 'sown',
  plantedOn,
  keepReason: 'A trial row, kept on purpose',
});

type Outcome = { kind: 'claim' | 'planting'; i: number; status: number | null; body: ApiBody | null; error?: string };

describe('SIGKILL in the middle of a burst of writes', () => {
  it('keeps every acknowledged claim and planting, writes none by halves, and overfills no shift', async () => {
    const holder = new CookieClient();
    expect((await holder.signIn(server.url, s.holder.email, s.holder.password)).status).toBe(200);
    const anon = new CookieClient();
    await anon.session(server.url);

    let acks = 0;
    let killed: Promise<void> | null = null;
    const outcomes: Outcome[] = [];
    const run = async (kind: Outcome['kind'], i: number, send: () => Promise<Answer>) => {
      try {
        const r = await send();
        outcomes.push({ kind, i, status: r.status, body: r.body });
        if (r.status >= 200 && r.status < 300) {
          acks++;
          if (!killed && acks >= KILL_AFTER_ACKS) killed = server.kill();
        }
      } catch (err) {
        outcomes.push({ kind, i, status: null, body: null, error: String((err as Error).cause ?? err) });
      }
    };
    // Claims and plantings interleaved, a pair every STAGGER_MS and never waiting for answers, so
    // early ones are answered while later ones are still being written when the kill comes
    // (all sent at one instant, the commits run far ahead of the answers, which queue for the pool).
    const burst: Promise<void>[] = [];
    for (let i = 0; i < Math.max(s.links.length, PLANTINGS); i++) {
      if (i < s.links.length) burst.push(run('claim', i, () => anon.post(server.url, '/api/shift-links/claim', { token: s.links[i].token })));
      if (i < PLANTINGS) burst.push(run('planting', i, () => holder.post(server.url, `/api/plots/${s.plotId}/plantings`, planting(i))));
      await new Promise((r) => setTimeout(r, STAGGER_MS));
    }
    await Promise.all(burst);
    expect(killed, `the burst ended before ${KILL_AFTER_ACKS} acknowledgements`).not.toBeNull();
    await killed;
    expect(server.child.signalCode).toBe('SIGKILL');

    const acked = outcomes.filter((o) => o.status !== null && o.status >= 200 && o.status < 300);
    const ackedClaims = acked.filter((o) => o.kind === 'claim');
    const ackedPlantings = acked.filter((o) => o.kind === 'planting');
    const lost = outcomes.filter((o) => o.status === null);
    const statuses = outcomes.map((o) => o.status);
    // The kill came mid-burst: some requests got no answer at all, and no answer was a 5xx.
    expect(lost.length).toBeGreaterThan(0);
    expect(statuses.filter((c) => c !== null && c >= 500)).toEqual([]);
    for (const o of outcomes.filter((x) => x.status !== null && (x.status < 200 || x.status >= 300))) {
      // The only refusal a claim may meet here is a full shift.
      expect(o.kind === 'claim' && o.status === 409 && /Already covered/.test(o.body?.error?.message ?? ''), JSON.stringify(o)).toBe(true);
    }

    server = await startServerProcess({}, { port });

    // Every acknowledged planting is there, in this season's book, read through the restarted server with the session from before.
    const ackedPlantingIds = ackedPlantings.map((o) => o.body?.id as number);
    const book = await holder.get(server.url, `/api/plots/${s.plotId}/book`);
    expect(book.status).toBe(200);
    const inBook = new Set((book.body.plantings ?? []).map((p) => p.id));
    expect(ackedPlantingIds.filter((id) => !inBook.has(id))).toEqual([]);

    // Every acknowledged claim holds a place, through its own link.
    const claimRows: Array<{ id: number; shift_id: number; user_id: number; status: string }> = await db('shift_claims').whereIn('shift_id', s.shiftIds).select('id', 'shift_id', 'user_id', 'status');
    for (const o of ackedClaims) {
      const link = s.links[o.i];
      expect(o.body?.state).toBe('yours');
      expect(claimRows.filter((c) => c.shift_id === link.shiftId && c.user_id === link.userId && c.status === 'taken'), `claim ${o.i}`).toHaveLength(1);
    }
    // No shift over capacity.
    const perShift = s.shiftIds.map((id) => claimRows.filter((c) => c.shift_id === id && c.status === 'taken').length);
    for (const n of perShift) expect(n).toBeLessThanOrEqual(CAPACITY);

    // Nothing by halves: each place has its used claim link, one release and one done link, and one confirmation in the outbox;
    // each used claim link has its place.
    const links: Array<{ claim_id: number | null; purpose: string; used_at: Date | null; user_id: number; shift_id: number }> = await db('shift_links')
      .whereIn('shift_id', s.shiftIds)
      .select('claim_id', 'purpose', 'used_at', 'user_id', 'shift_id');
    for (const c of claimRows) {
      const mine = links.filter((l) => l.claim_id === c.id);
      expect(mine.map((l) => l.purpose).sort(), `links of claim ${c.id}`).toEqual(['claim', 'done', 'release']);
      expect(mine.find((l) => l.purpose === 'claim')!.used_at).not.toBeNull();
    }
    const usedClaimLinks = links.filter((l) => l.purpose === 'claim' && l.used_at !== null);
    const claimsNeverWritten = lost.filter((o) => o.kind === 'claim' && !claimRows.some((c) => c.user_id === s.links[o.i].userId)).length;
    expect(usedClaimLinks.length).toBe(claimRows.length);
    const emails = await db('users').whereIn('id', claimRows.map((c) => c.user_id)).pluck('email');
    const confirmations = await db('mail_outbox').where({ club_id: s.clubId, kind: 'shift_taken' }).select('to_address', 'status');
    expect(confirmations.map((m: { to_address: string }) => m.to_address).sort()).toEqual([...emails].sort());
    expect(await db('mail_outbox').where({ club_id: s.clubId }).whereNot({ kind: 'shift_taken' }).count({ n: '*' })).toEqual([{ n: 0 }]);

    // Plantings: the stored findings equal a full re-check, every planting of this season has its
    // finding, and re-planning the tasks would write nothing (each planting's tasks came with it).
    const stored: Array<{ planting_id: number; key: string; severity: string; message: string }> = await db('findings').where({ site_id: s.siteId }).select('planting_id', 'key', 'severity', 'message');
    const key = (f: { plantingId: number; key: string; severity: string; message: string }) => `${f.plantingId}|${f.key}|${f.severity}|${f.message}`;
    const fresh = checkPlots(await loadCheckContext(db, s.siteId)).map(key).sort();
    expect(stored.map((r) => key({ plantingId: r.planting_id, key: r.key, severity: r.severity, message: r.message })).sort()).toEqual(fresh);
    const thisSeason: number[] = await db('plantings').where({ plot_id: s.plotId, season_id: s.seasonId }).pluck('id');
    // The kill came while writes were still to be made: some sent never reached the database.
    expect(claimsNeverWritten + (PLANTINGS - thisSeason.length)).toBeGreaterThan(0);
    const withFinding = new Set(stored.map((r) => r.planting_id));
    expect(thisSeason.filter((id) => !withFinding.has(id))).toEqual([]);
    const tasksOf = await db('tasks').whereIn('planting_id', thisSeason).where({ origin: 'generated' }).distinct().pluck('planting_id');
    expect(tasksOf.length).toBe(thisSeason.length);
    // Run in a transaction that is then rolled back, so the check itself changes nothing.
    const ROLLBACK = new Error('rollback: a dry run');
    let replan: unknown = null;
    await db
      .transaction(async (trx) => {
        replan = await regenerateTasks(trx, s.siteId);
        throw ROLLBACK;
      })
      .catch((e) => {
        if (e !== ROLLBACK) throw e;
      });
    expect(replan).toEqual({ created: 0, updated: 0, removed: 0 });

    // The restarted server takes writes again.
    expect((await holder.post(server.url, `/api/plots/${s.plotId}/plantings`, planting(999))).status).toBe(201);

    console.info(
      `[faults] sigkill: ${outcomes.length} requests, ${acked.length} acknowledged (${ackedClaims.length} claims, ${ackedPlantings.length} plantings), ` +
        `${outcomes.filter((o) => o.status === 409).length}×409, ${lost.length} without an answer (${lost.filter((o) => o.kind === 'claim').length} claims, of which ${claimsNeverWritten} never written); after restart ${claimRows.length} places (per shift ${perShift.join('/')}), ` +
        `${thisSeason.length} plantings this season (${thisSeason.length - ackedPlantingIds.length} committed but not acknowledged), ${stored.length} findings, ${confirmations.length} confirmations`,
    );
  });
});
