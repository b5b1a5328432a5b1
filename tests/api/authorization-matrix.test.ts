import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { createFeeForAllocation } from '../../server/services/fee-charges';
import { resetFeed } from '../../server/services/calendar-feeds';
import { mailIdle } from '../../server/services/outbox';
import { taskRunsIdle } from '../../server/services/task-runs';
import { newToken } from '../../server/services/tokens';
import { buildApplication, buildClub, buildCrop, buildMember } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';
import { rowCounts } from '../helpers/row-counts';
import { apiRoutes, routeKey } from '../helpers/routes';
import { AUTHORIZATION_TABLE, expected, ROLES, type MatrixRole } from './authorization-matrix.table';

// Authorization across the whole API (OWASP ASVS 4.0.3 level 2, V4 Access Control): every route the
// app has, found by walking its router (tests/helpers/routes.ts), is sent as five people against club
// A's real records, and must answer as the table (authorization-matrix.table.ts) says. Then direct
// object references to other people's records, each refused without a write; and on every answer
// that lets a request through, nobody's name or address shows to someone who may not see it.

// The matrix sends the public form and the link routes several times each from one address.
const t = setupTestApp({ APPLY_RATE_LIMIT: '100000', AUTH_RATE_LIMIT: '100000' });

const ZONE = 'Europe/London';
// "This season" in the plot book is the newest season whose year has begun in the club's zone (DEVELOPERS.md).
const TODAY = localToday(ZONE);
const YEAR = Number(TODAY.slice(0, 4));
/** A well-formed link token that is not one of ours: 43 URL-safe characters, the length newToken makes. */
const FAKE_TOKEN = 'Zz9-'.repeat(10) + 'abc';

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
type Person = Agent & { person: { id: number; email: string; name: string; password: string | null } };

interface Fixture {
  clubId: number;
  clubSlug: string;
  otherClubId: number;
  otherSeasonId: number;
  siteId: number;
  plot1: number;
  plot2: number;
  freePlot: number;
  seasonId: number;
  nextSeasonId: number;
  feeId: number;
  applicationId: number;
  offerId: number;
  renewalId: number;
  messageId: number;
  inviteId: number;
  spareMemberId: number;
  radishId: number;
  clubCropId: number;
  referenceRelationId: number;
  clubRelationId: number;
  planting1: number;
  planting2: number;
  harvest1: number;
  harvest2: number;
  observation1: number;
  observation2: number;
  photo1: number;
  photo2: number;
  task1: number;
  task2: number;
  handover1: number;
  runId: number;
  shiftId: number;
  claimId: number;
  feedUrl: string;
  weatherDay: string;
  agents: Record<MatrixRole, Agent>;
  holder2: Person;
  volunteer2: Person;
  /** Names and addresses of everyone in the fixture, to look for in answers. */
  people: Record<string, { name: string; email: string }>;
}
let f: Fixture;

const jpeg = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: '#6a8f3c' } }).jpeg().toBuffer();
const png = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: '#d8e4c8' } }).png().toBuffer();

/** A planting the holder could make: a radish row in the plot's corner, this season. */
const radishBody = (cropId: number, more: Record<string, unknown> = {}) => ({
  cropId,
  method: 'sown',
  plantedOn: `${YEAR}-04-10`,
  part: { x: 0, y: 0, width: 0.3, length: 2 },
  ...more,
});

async function rename(p: { person: { id: number; name: string } }, name: string) {
  await t.db('users').where({ id: p.person.id }).update({ name });
  p.person.name = name;
}

beforeAll(async () => {
  await truncateAll(t.db);
  const a = await buildClub(t.db, { name: 'Matrix Club A' });
  const b = await buildClub(t.db, { name: 'Matrix Club B' });
  const coordinator = (await signedInMember(t, a.id, ['coordinator'])) as Person;
  const holder = (await signedInMember(t, a.id, ['plot_holder'])) as Person;
  const holder2 = (await signedInMember(t, a.id, ['plot_holder'])) as Person;
  const volunteer = (await signedInMember(t, a.id, ['volunteer'])) as Person;
  const volunteer2 = (await signedInMember(t, a.id, ['volunteer'])) as Person;
  const otherCoordinator = (await signedInMember(t, b.id, ['coordinator'])) as Person;
  const anonymous = await browserLikeAgent(t.app);
  // Names no route text could contain by chance, so finding one in an answer means that person leaked.
  await rename(coordinator, 'Ottilie Marchbank');
  await rename(holder, 'Hollis Treadwell');
  await rename(holder2, 'Imogen Fairleigh');
  await rename(volunteer, 'Wendell Ashby');
  await rename(volunteer2, 'Vesna Pollard');
  await rename(otherCoordinator, 'Bartholomew Quince');

  // Club A's site (the first site sets the club's zone) with three plots: holder 1's, holder 2's, and a free one.
  const site = (await coordinator.post(`/api/clubs/${a.id}/sites`, { name: 'Matrix field', latitude: 51.5, longitude: -0.1, timeZone: ZONE, width: 40, length: 30 }).expect(201)).body;
  const plot = async (label: string, x: number) => (await coordinator.post(`/api/sites/${site.id}/plots`, { label, x, y: 0, width: 3, length: 6 }).expect(201)).body.id as number;
  const plot1 = await plot('M-1', 0);
  const plot2 = await plot('M-2', 5);
  const freePlot = await plot('M-3', 10);
  await coordinator.put(`/api/clubs/${a.id}/fee-schedule`, {
    basis: 'kind', areaUnit: 'm2', rateMinorPerArea: 0, priceInGroundMinor: 4000, priceRaisedBedMinor: 0, priceContainerMinor: 0,
    priceSharedBedMinor: 0, concessionPercent: 0, depositMinor: 0,
  }).expect(200);
  const [season] = await t.db('seasons').insert({ club_id: a.id, year: YEAR }).returning('id');
  const [alloc1] = await t.db('allocations').insert({ season_id: season.id, plot_id: plot1, user_id: holder.person.id, source: 'manual' }).returning('id');
  const [alloc2] = await t.db('allocations').insert({ season_id: season.id, plot_id: plot2, user_id: holder2.person.id, source: 'manual' }).returning('id');
  // Holder 1 owes this season's fee (arrears, the coordinator's to see).
  const feeId = await t.db.transaction((trx) => createFeeForAllocation(trx, { allocationId: alloc1.id }));
  await t.db.transaction((trx) => createFeeForAllocation(trx, { allocationId: alloc2.id }));
  // Next season is open: holder 1 has a renewal waiting, the applicant an offer of the free plot.
  const [next] = await t.db('seasons').insert({ club_id: a.id, year: YEAR + 1 }).returning('id');
  const applicant = await buildApplication(t.db, { clubId: a.id, name: 'Aurelio Waitforth', status: 'offered' });
  const deadline = new Date(Date.now() + 10 * 86_400_000);
  const [offer] = await t.db('offers').insert({ season_id: next.id, plot_id: freePlot, application_id: applicant.id, token_hash: newToken().hash, deadline }).returning('id');
  const [renewal] = await t.db('renewals')
    .insert({ season_id: next.id, previous_allocation_id: alloc1.id, plot_id: plot1, user_id: holder.person.id, token_hash: newToken().hash, deadline })
    .returning('id');
  const [otherSeason] = await t.db('seasons').insert({ club_id: b.id, year: YEAR }).returning('id');

  // An invitation (its e-mail is the outbox message the matrix resends) and a member the member routes act on.
  const invite = (await coordinator.post(`/api/clubs/${a.id}/invites`, { email: 'ingrid.invitee@example.org', name: 'Ingrid Inviteson', roles: ['volunteer'] }).expect(201)).body;
  const spare = await buildMember(t.db, { clubId: a.id, roles: ['volunteer'], user: { name: 'Sparrow Member' } });

  // Crop notes: a reference crop, a club crop and a club relation of club A, and a reference relation.
  const radish = await buildCrop(t.db, 'radish');
  const clubCrop = (await coordinator.post(`/api/clubs/${a.id}/crops`, {
    commonName: 'Matrix bean',
    botanicalName: { value: 'Vicia faba', source: 'from-memory' },
    family: { value: 'Fabaceae', source: 'from-memory' },
    kind: 'legume',
    sowing: { value: 'direct', source: 'from-memory' },
    daysToMaturity: { value: { min: 80, max: 100, from: 'sowing' }, source: 'from-memory' },
  }).expect(201)).body;
  const referenceRelation = await t.db('crop_relations').whereNull('club_id').orderBy('id').first('id', 'crop_a_id', 'crop_b_id');
  const clubRelation = (await coordinator.post(`/api/clubs/${a.id}/crops/relations`, {
    cropAId: clubCrop.id, cropBId: radish.id, effect: 'beneficial', scope: { kind: 'same_plot' }, reason: 'Matrix pair', evidence: 'common_practice', source: 'common-practice',
  }).expect(201)).body;

  // Both holders' books: a planting with a harvest, an observation with a photo.
  const book = async (who: Person, plotId: number, variety: string) => {
    const planting = (await who.post(`/api/plots/${plotId}/plantings`, radishBody(radish.id, { variety })).expect(201)).body.id as number;
    const harvest = (await who.post(`/api/plantings/${planting}/harvests`, { harvestedOn: `${YEAR}-06-01`, count: 3 }).expect(201)).body.id as number;
    const observation = (await who.post(`/api/plots/${plotId}/observations`, { pestSlug: 'aphids', severity: 'light', observedOn: `${YEAR}-05-01` }).expect(201)).body.id as number;
    const photo = await who.agent.post(`/api/observations/${observation}/photos`).set('X-CSRF-Token', who.csrf).attach('photo', await jpeg(400, 300), 'leaf.jpg');
    expect(photo.status, JSON.stringify(photo.body)).toBe(201);
    return { planting, harvest, observation, photo: photo.body.photos[0].id as number };
  };
  const book1 = await book(holder, plot1, 'Matrix Breakfast');
  const book2 = await book(holder2, plot2, 'Fairleigh Secret');

  // Tasks on each plot, the holders' own (not handed to volunteers), and a handover of holder 1's.
  const task = async (plotId: number) =>
    (await t.db('tasks')
      .insert({ club_id: a.id, site_id: site.id, plot_id: plotId, origin: 'coordinator', kind: 'weed', title: 'Weed the row', due_on: TODAY, window_from: TODAY, window_to: addCalendarDays(TODAY, 7), for_volunteers: false })
      .returning('id'))[0].id as number;
  const task1 = await task(plot1);
  const task2 = await task(plot2);
  const handover = (await holder.post(`/api/plots/${plot1}/handovers`, { fromOn: addCalendarDays(TODAY, 20), toOn: addCalendarDays(TODAY, 27), kinds: ['water'] }).expect(201)).body;
  const run = (await coordinator.post(`/api/sites/${site.id}/task-runs`).expect(202)).body;
  await taskRunsIdle(t.db);

  // The weather log has a past day; the site a background image.
  const weatherDay = addCalendarDays(TODAY, -3);
  await coordinator.put(`/api/sites/${site.id}/weather/${weatherDay}`, { rainMm: 4.5, source: 'gauge' }).expect(201);
  await coordinator.agent.post(`/api/sites/${site.id}/background`).set('X-CSRF-Token', coordinator.csrf).attach('image', await png(400, 300), 'plan.png').expect(200);

  // A shift: the volunteer holds a place (with a done photo on it) and a personal calendar feed.
  const shift = (await coordinator.post(`/api/clubs/${a.id}/shifts`, {
    siteId: site.id, title: 'Matrix watering', kind: 'water', date: addCalendarDays(TODAY, 5), startTime: '18:00', endTime: '19:00',
    capacity: 3, estHours: 1, instructions: 'Fill the cans at the trough.', taskIds: [],
  }).expect(201)).body;
  await volunteer.post(`/api/shifts/${shift.id}/claim`).expect(200);
  const claim = await t.db('shift_claims').where({ shift_id: shift.id, user_id: volunteer.person.id }).first('id');
  // A stored done photo (as doneShift writes it) on the volunteer's place; the file is a real WebP.
  const photoName = `${'ab'.repeat(16)}.webp`;
  fs.mkdirSync(path.join(t.config.uploadDir, 'shift-photos'), { recursive: true });
  fs.writeFileSync(path.join(path.join(t.config.uploadDir, 'shift-photos'), photoName), await sharp({ create: { width: 20, height: 20, channels: 3, background: '#888' } }).webp().toBuffer());
  await t.db('shift_claims').where({ id: claim.id }).update({ photo_path: photoName });
  const feed = (await volunteer.post(`/api/clubs/${a.id}/feeds/personal`).expect(200)).body;

  // A failed message in club A's outbox (the resend route's subject).
  await mailIdle();
  const message = await t.db('mail_outbox').where({ club_id: a.id }).orderBy('id').first('id');
  await t.db('mail_outbox').where({ id: message.id }).update({ status: 'failed' });

  const people: Fixture['people'] = {};
  for (const [key, p] of Object.entries({ coordinator, holder, holder2, volunteer, volunteer2, otherCoordinator })) people[key] = { name: p.person.name, email: p.person.email };
  people.applicant = { name: applicant.name, email: applicant.email };
  people.invitee = { name: 'Ingrid Inviteson', email: 'ingrid.invitee@example.org' };

  f = {
    clubId: a.id, clubSlug: a.slug, otherClubId: b.id, otherSeasonId: otherSeason.id, siteId: site.id, plot1, plot2, freePlot,
    seasonId: season.id, nextSeasonId: next.id, feeId, applicationId: applicant.id, offerId: offer.id, renewalId: renewal.id,
    messageId: message.id, inviteId: invite.id, spareMemberId: spare.id, radishId: radish.id, clubCropId: clubCrop.id,
    referenceRelationId: referenceRelation.id, clubRelationId: clubRelation.id,
    planting1: book1.planting, planting2: book2.planting, harvest1: book1.harvest, harvest2: book2.harvest,
    observation1: book1.observation, observation2: book2.observation, photo1: book1.photo, photo2: book2.photo,
    task1, task2, handover1: handover.id, runId: run.id, shiftId: shift.id, claimId: claim.id, feedUrl: feed.url, weatherDay,
    agents: { anonymous, volunteer, holder, otherCoordinator, coordinator },
    holder2, volunteer2, people,
  };
}, 60_000);

afterAll(async () => {
  // Runs and mail the requests started finish before the database goes.
  await taskRunsIdle(t.db);
  await t.close();
});

// ---------------------------------------------------------------------------------------------
// Sending a request

interface Spec {
  params?: Record<string, string | number>;
  body?: object;
  query?: Record<string, string | number>;
  /** Sent from this agent instead of the role's (signing out must not end the role's session for the routes after it). */
  as?: Agent;
}

function send(agent: Agent, method: string, url: string, spec: Spec = {}): Promise<request.Response> {
  const m = method.toLowerCase() as Method;
  let req = agent.agent[m](url).set('X-CSRF-Token', agent.csrf);
  if (spec.query) req = req.query(spec.query);
  if (m !== 'get') req = req.send(spec.body ?? {});
  return req;
}

/** Club A's real records, by path parameter. */
function defaultParams(x: Fixture): Record<string, string | number> {
  return {
    clubId: x.clubId, clubSlug: x.clubSlug, siteId: x.siteId, plotId: x.plot1, seasonId: x.seasonId, feeId: x.feeId,
    applicationId: x.applicationId, offerId: x.offerId, renewalId: x.renewalId, messageId: x.messageId, inviteId: x.inviteId,
    userId: x.spareMemberId, role: 'volunteer', cropId: x.radishId, field: 'daysToMaturity', relationId: x.referenceRelationId,
    taskId: x.task1, handoverId: x.handover1, runId: x.runId, plantingId: x.planting1, harvestId: x.harvest1,
    observationId: x.observation1, photoId: x.photo1, shiftId: x.shiftId, claimId: x.claimId,
    file: new URL(x.feedUrl).pathname.split('/').pop()!, day: x.weatherDay,
    // A made-up stop-mail token (the route answers 404 to everyone) and a template that exists.
    token: FAKE_TOKEN, name: 'club_news',
  };
}

const version = async (table: string, id: number) => (await t.db(table).where({ id }).first('version')).version as number;
const tokenQuery = { query: { token: FAKE_TOKEN } };
const tokenBody = { body: { token: FAKE_TOKEN } };

/**
 * What a route needs beyond club A's ids for a request to reach its authorization: a body the schema
 * accepts where the service decides who may (the body is parsed first there), and a new record for a
 * request that would use one up (the roles before would otherwise leave the next one a 404).
 * Routes not listed get an empty body, which middleware-checked routes refuse with 400 after authorising.
 */
const SPECS: Record<string, (x: Fixture, role: MatrixRole) => Spec | Promise<Spec>> = {
  'PUT /api/session/club': (x) => ({ body: { clubId: x.clubId } }),
  'DELETE /api/session': async (x, role) => {
    const fresh = await browserLikeAgent(t.app);
    // The same person in a second session; buildMember's default password.
    if (role !== 'anonymous') expect((await fresh.signIn(x.people[role].email, 'correct-horse-battery')).status).toBe(200);
    return { as: fresh };
  },
  'POST /api/password-resets': () => ({ body: { email: 'nobody-matrix@example.org' } }),
  'GET /api/password-resets/check': () => tokenQuery,
  'POST /api/password-resets/complete': () => ({ body: { token: FAKE_TOKEN, password: 'a long enough new password' } }),
  'GET /api/invites/preview': () => tokenQuery,
  'POST /api/invites/accept': () => ({ body: { token: FAKE_TOKEN, name: 'Nobody', password: 'a long enough new password' } }),
  'POST /api/club-signups': () => ({
    body: { name: 'Nobody', email: 'nobody-matrix@example.org', password: 'a long enough new password', clubName: 'Matrix Club', timeZone: 'UTC', currency: 'EUR', units: 'metric' },
  }),
  'GET /api/club-signups/check': () => tokenQuery,
  'POST /api/club-signups/confirm': () => ({ body: { token: FAKE_TOKEN } }),
  'PATCH /api/clubs/:clubId/checklist': () => ({ body: { hidden: false } }),
  'GET /api/offers/preview': () => tokenQuery,
  'POST /api/offers/accept': () => tokenBody,
  'POST /api/offers/decline': () => tokenBody,
  'GET /api/renewals/preview': () => tokenQuery,
  'POST /api/renewals/keep': () => tokenBody,
  'POST /api/renewals/release': () => tokenBody,
  'GET /api/shift-links/preview': () => tokenQuery,
  'POST /api/shift-links/claim': () => tokenBody,
  'POST /api/shift-links/release': () => tokenBody,
  'POST /api/shift-links/done': () => tokenBody,
  // A new secret address for the volunteer's feed each time (POST …/feeds/personal replaces addresses).
  'GET /api/feeds/:file': async (x) => {
    const volunteer = await t.db('users').where({ email: x.people.volunteer.email }).first('id');
    const feed = await resetFeed(t.db, { clubId: x.clubId, userId: volunteer.id, kind: 'personal', publicUrl: t.config.publicUrl });
    return { params: { file: new URL(feed.url).pathname.split('/').pop()! } };
  },
  'DELETE /api/clubs/:clubId/members/:userId': async (x) => ({ params: { userId: (await buildMember(t.db, { clubId: x.clubId, roles: ['volunteer'] })).id } }),
  'DELETE /api/clubs/:clubId/members/:userId/roles/:role': async (x) => ({
    params: { userId: (await buildMember(t.db, { clubId: x.clubId, roles: ['volunteer', 'plot_holder'] })).id, role: 'volunteer' },
  }),
  'DELETE /api/clubs/:clubId/invites/:inviteId': async (x) => {
    const [row] = await t.db('invites')
      .insert({ club_id: x.clubId, email: `cancel-${Date.now()}-${Math.random()}@example.org`, name: 'To be cancelled', roles: ['volunteer'], token_hash: newToken().hash, expires_at: new Date(Date.now() + 86_400_000) })
      .returning('id');
    return { params: { inviteId: row.id } };
  },
  'DELETE /api/clubs/:clubId/crops/:cropId/overrides/:field': async (x) => {
    await t.db('crop_overrides')
      .insert({ club_id: x.clubId, crop_id: x.radishId, field: 'daysToMaturity', value: JSON.stringify({ value: { min: 25, max: 30, from: 'sowing' }, source: 'from-memory' }) })
      .onConflict(['club_id', 'crop_id', 'field'])
      .ignore();
    return {};
  },
  'DELETE /api/sites/:siteId/background': async (x) => {
    const site = await t.db('sites').where({ id: x.siteId }).first('background_file');
    if (!site.background_file) {
      const c = x.agents.coordinator;
      await c.agent.post(`/api/sites/${x.siteId}/background`).set('X-CSRF-Token', c.csrf).attach('image', await png(400, 300), 'plan.png').expect(200);
    }
    return {};
  },
  'POST /api/plots/:plotId/plantings/check': (x) => ({ body: radishBody(x.radishId) }),
  'GET /api/plots/:plotId/what-fits': () => ({ query: { date: `${YEAR}-05-01` } }),
  'POST /api/tasks/:taskId/done': async (x) => ({ body: { version: await version('tasks', x.task1) } }),
  'POST /api/tasks/:taskId/reopen': async (x) => ({ body: { version: await version('tasks', x.task1) } }),
  'POST /api/tasks/:taskId/skip': async (x) => ({ body: { version: await version('tasks', x.task1) } }),
  'POST /api/plots/:plotId/handovers': () => ({ body: { fromOn: addCalendarDays(TODAY, 40), toOn: addCalendarDays(TODAY, 41), kinds: ['weed'] } }),
  'DELETE /api/handovers/:handoverId': async (x) => {
    const [row] = await t.db('task_handovers').insert({ club_id: x.clubId, plot_id: x.plot1, from_on: addCalendarDays(TODAY, 60), to_on: addCalendarDays(TODAY, 61), kinds: ['water'] }).returning('id');
    return { params: { handoverId: row.id } };
  },
  // A coordinator's own task each time (deleting one uses it up).
  'DELETE /api/tasks/:taskId': async (x) => {
    const [row] = await t.db('tasks')
      .insert({ club_id: x.clubId, site_id: x.siteId, plot_id: null, origin: 'coordinator', kind: 'other', title: 'Tidy the shed', due_on: TODAY, window_from: TODAY, window_to: TODAY })
      .returning('id');
    return { params: { taskId: row.id } };
  },
  'POST /api/plots/:plotId/plantings': (x) => ({ body: radishBody(x.radishId, { part: { x: 2, y: 4, width: 0.3, length: 1 } }) }),
  'PATCH /api/plantings/:plantingId': async (x) => ({ body: { version: await version('plantings', x.planting1), notes: 'Thinned' } }),
  'DELETE /api/plantings/:plantingId': async (x) => {
    const [row] = await t.db('plantings').insert({ plot_id: x.plot1, season_id: x.seasonId, crop_id: x.radishId, method: 'sown', planted_on: `${YEAR}-04-20` }).returning('id');
    return { params: { plantingId: row.id } };
  },
  'POST /api/plantings/:plantingId/harvests': () => ({ body: { harvestedOn: `${YEAR}-06-02`, count: 2 } }),
  'DELETE /api/harvests/:harvestId': async (x) => {
    const [row] = await t.db('harvests').insert({ planting_id: x.planting1, harvested_on: `${YEAR}-06-03`, count: 1 }).returning('id');
    return { params: { harvestId: row.id } };
  },
  'POST /api/plots/:plotId/observations': () => ({ body: { pestSlug: 'aphids', severity: 'light', observedOn: `${YEAR}-05-02` } }),
  'DELETE /api/observations/:observationId': async (x) => {
    const [row] = await t.db('observations').insert({ plot_id: x.plot1, name: 'Aphids', kind: 'pest', severity: 'light', observed_on: `${YEAR}-05-03` }).returning('id');
    return { params: { observationId: row.id } };
  },
  'PUT /api/sites/:siteId/weather/:day': () => ({ body: { rainMm: 2.5, source: 'gauge' } }),
  'DELETE /api/sites/:siteId/weather/:day': async (x) => {
    const day = addCalendarDays(TODAY, -9);
    await t.db('weather_days').insert({ site_id: x.siteId, day, rain_mm: 1, source: 'gauge' }).onConflict(['site_id', 'day']).ignore();
    return { params: { day } };
  },
  'POST /api/sites/:siteId/weather-imports': () => ({ body: { csv: `date,rain\n${addCalendarDays(TODAY, -20)},2.5\n`, units: 'metric', duplicates: 'skip', commit: false } }),
};

// ---------------------------------------------------------------------------------------------
// Who may see whom

/** Names and addresses a role must not find in any answer it is given (a coordinator of club A sees their club's people). */
function secretsFor(role: MatrixRole, x: Fixture): string[] {
  const p = x.people;
  const all = (keys: string[]) => keys.flatMap((k) => [p[k].name, p[k].email]);
  switch (role) {
    case 'anonymous':
      return all(Object.keys(p));
    case 'otherCoordinator':
      return all(Object.keys(p).filter((k) => k !== 'otherCoordinator'));
    case 'coordinator':
      return all(['otherCoordinator']);
    case 'volunteer':
    case 'holder':
      // Members may know their coordinator's name (a season says who opened it), never the address.
      return [...all(Object.keys(p).filter((k) => !['coordinator', 'otherCoordinator', role].includes(k))), ...all(['otherCoordinator']), p.coordinator.email];
  }
}

function leaked(res: request.Response, secrets: string[]): string[] {
  const type = String(res.headers['content-type'] ?? '');
  if (!/json|text|calendar/.test(type)) return [];
  const text = type.includes('json') ? JSON.stringify(res.body) : res.text;
  return secrets.filter((s) => text.includes(s));
}

// ---------------------------------------------------------------------------------------------
// Direct object references: each refused, with nothing written

async function refusedWithoutWrites(checks: Array<[label: string, run: () => Promise<request.Response>, status: number]>) {
  const before = await rowCounts(t.db);
  const wrong: string[] = [];
  for (const [label, run, status] of checks) {
    const res = await run();
    if (res.status !== status) wrong.push(`${label}: expected ${status}, got ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
  }
  await mailIdle();
  expect(wrong).toEqual([]);
  expect(await rowCounts(t.db)).toEqual(before);
}

describe('direct references to other people’s records', () => {
  it('holder 1 can neither read nor change holder 2’s plot book, planting, harvest, observation or photo (403: same club, not theirs)', async () => {
    const h = f.agents.holder;
    const planting = await t.db('plantings').where({ id: f.planting2 }).first();
    const image = await jpeg(200, 150);
    const photo = () => h.agent.post(`/api/observations/${f.observation2}/photos`).set('X-CSRF-Token', h.csrf).attach('photo', image, 'mine.jpg');
    await refusedWithoutWrites([
      ['read the book', () => h.get(`/api/plots/${f.plot2}/book`), 403],
      ['add a planting', () => h.post(`/api/plots/${f.plot2}/plantings`, radishBody(f.radishId)), 403],
      ['check a planting', () => h.post(`/api/plots/${f.plot2}/plantings/check`, radishBody(f.radishId)), 403],
      ['what fits', () => h.get(`/api/plots/${f.plot2}/what-fits?date=${YEAR}-05-01`), 403],
      ['read the planting', () => h.get(`/api/plantings/${f.planting2}`), 403],
      ['change the planting', () => h.patch(`/api/plantings/${f.planting2}`, { version: planting.version, notes: 'Mine now' }), 403],
      ['delete the planting', () => h.delete(`/api/plantings/${f.planting2}`), 403],
      ['add a harvest', () => h.post(`/api/plantings/${f.planting2}/harvests`, { harvestedOn: `${YEAR}-06-01`, count: 9 }), 403],
      ['delete the harvest', () => h.delete(`/api/harvests/${f.harvest2}`), 403],
      ['add an observation', () => h.post(`/api/plots/${f.plot2}/observations`, { pestSlug: 'aphids', severity: 'light', observedOn: `${YEAR}-05-01` }), 403],
      ['delete the observation', () => h.delete(`/api/observations/${f.observation2}`), 403],
      ['add a photo', photo, 403],
      ['open the photo', () => h.get(`/api/observation-photos/${f.photo2}`), 403],
      ['open the thumbnail', () => h.get(`/api/observation-photos/${f.photo2}/thumb`), 403],
      ['read the plot’s tasks', () => h.get(`/api/plots/${f.plot2}/tasks`), 403],
      ['mark the plot’s task done', async () => h.post(`/api/tasks/${f.task2}/done`, { version: await version('tasks', f.task2) }), 403],
      ['hand the plot’s tasks over', () => h.post(`/api/plots/${f.plot2}/handovers`, { fromOn: addCalendarDays(TODAY, 1), toOn: addCalendarDays(TODAY, 2), kinds: ['weed'] }), 403],
      // Holder 2's planting named from holder 1's own plot: refused as not on this plot, saying nothing of it.
      ['check against their planting', () => h.post(`/api/plots/${f.plot1}/plantings/check`, { ...radishBody(f.radishId), plantingId: f.planting2 }), 400],
    ]);
    expect(await t.db('plantings').where({ id: f.planting2 }).first()).toEqual(planting);
  });

  it('when the club shares plot books, holder 1 reads holder 2’s book without a name in it, and still changes nothing', async () => {
    const h = f.agents.holder;
    await t.db('clubs').where({ id: f.clubId }).update({ shares_plot_books: true });
    try {
      const book = await h.get(`/api/plots/${f.plot2}/book`).expect(200);
      expect(book.body.canWrite).toBe(false);
      expect(JSON.stringify(book.body)).toContain('Fairleigh Secret');
      expect(leaked(book, secretsFor('holder', f))).toEqual([]);
      expect((await h.get(`/api/observation-photos/${f.photo2}`)).status).toBe(200);
      const planting = await t.db('plantings').where({ id: f.planting2 }).first('version');
      await refusedWithoutWrites([
        ['add a planting', () => h.post(`/api/plots/${f.plot2}/plantings`, radishBody(f.radishId)), 403],
        ['change the planting', () => h.patch(`/api/plantings/${f.planting2}`, { version: planting.version, notes: 'Mine now' }), 403],
        ['delete the planting', () => h.delete(`/api/plantings/${f.planting2}`), 403],
        ['add a harvest', () => h.post(`/api/plantings/${f.planting2}/harvests`, { harvestedOn: `${YEAR}-06-01`, count: 9 }), 403],
        ['delete the harvest', () => h.delete(`/api/harvests/${f.harvest2}`), 403],
        ['delete the observation', () => h.delete(`/api/observations/${f.observation2}`), 403],
      ]);
    } finally {
      await t.db('clubs').where({ id: f.clubId }).update({ shares_plot_books: false });
    }
  });

  it('a volunteer can neither release nor mark done another volunteer’s place, nor open its photo', async () => {
    const v2 = f.volunteer2;
    const claim = await t.db('shift_claims').where({ id: f.claimId }).first();
    expect(claim.status).toBe('taken');
    await refusedWithoutWrites([
      // Both act on the caller's own place only: volunteer 2 holds none.
      ['release', () => v2.post(`/api/shifts/${f.shiftId}/release`), 409],
      ['mark done', () => v2.post(`/api/shifts/${f.shiftId}/done`, { note: 'Done by someone else' }), 409],
      ['open the done photo', () => v2.get(`/api/shifts/${f.shiftId}/claims/${f.claimId}/photo`), 404],
      ['open the done photo as a holder', () => f.agents.holder.get(`/api/shifts/${f.shiftId}/claims/${f.claimId}/photo`), 404],
    ]);
    expect(await t.db('shift_claims').where({ id: f.claimId }).first()).toEqual(claim);
    // The shift itself tells volunteer 2 how many places are taken, not by whom.
    const seen = await v2.get(`/api/shifts/${f.shiftId}`).expect(200);
    expect(seen.body.people).toBeNull();
    expect(JSON.stringify(seen.body)).not.toContain(f.people.volunteer.name);
  });

  it('a calendar feed opens only at its secret address: not by the person’s id, a guess, or an address that was replaced', async () => {
    const volunteer = await t.db('users').where({ email: f.people.volunteer.email }).first('id');
    const old = await resetFeed(t.db, { clubId: f.clubId, userId: volunteer.id, kind: 'personal', publicUrl: t.config.publicUrl });
    const current = await resetFeed(t.db, { clubId: f.clubId, userId: volunteer.id, kind: 'personal', publicUrl: t.config.publicUrl });
    const path = (url: string) => new URL(url).pathname;
    for (const who of [f.agents.anonymous, f.agents.holder, f.agents.coordinator]) {
      await refusedWithoutWrites([
        ['by user id', () => who.get(`/api/feeds/${volunteer.id}.ics`), 404],
        ['by user id padded to a token’s length', () => who.get(`/api/feeds/${String(volunteer.id).padStart(43, '0')}.ics`), 404],
        ['by a guessed token', () => who.get(`/api/feeds/${FAKE_TOKEN}.ics`), 404],
        ['by the replaced address', () => who.get(path(old.url)), 404],
      ]);
    }
    // The current address works without a session and shows the volunteer's shift, with nobody's name.
    const text = (await f.agents.anonymous.get(path(current.url)).expect(200)).text;
    expect(text).toContain('Matrix watering');
    expect(Object.values(f.people).flatMap((p) => [p.name, p.email]).filter((s) => text.includes(s))).toEqual([]);
    // Holder 1's own feed lists only holder 1's places: none.
    const own = (await f.agents.holder.post(`/api/clubs/${f.clubId}/feeds/personal`).expect(200)).body;
    expect((await f.agents.anonymous.get(path(own.url)).expect(200)).text).not.toContain('Matrix watering');
    // Who has a feed is each person's own business: the status route answers about the caller only.
    expect((await f.agents.holder.get(`/api/clubs/${f.clubId}/feeds`).expect(200)).body.personal).not.toBeNull();
    expect((await f.volunteer2.get(`/api/clubs/${f.clubId}/feeds`).expect(200)).body).toEqual({ personal: null, club: null });
  });

  it('club B’s coordinator reads nothing of club A’s members, fees, exports or outbox, and reaches none of its records by id', async () => {
    const b = f.agents.otherCoordinator;
    const holder = await t.db('users').where({ email: f.people.holder.email }).first('id');
    const roles = await t.db('memberships').where({ club_id: f.clubId }).orderBy(['user_id', 'role']).select();
    const A = `/api/clubs/${f.clubId}`;
    const B = `/api/clubs/${f.otherClubId}`;
    await refusedWithoutWrites([
      // Club A's lists, by club A's address: 403 (not a member).
      ...(['members', 'invites', 'waitlist', 'fees', 'fees.csv', 'fee-schedule', 'exports/members.csv', 'exports/waitlist.csv', 'exports/allocations.csv', 'outbox', 'mailings', 'hours', 'hours.csv', 'findings'] as const).map(
        (p) => [`GET ${p}`, () => b.get(`${A}/${p}`), 403] as [string, () => Promise<request.Response>, number],
      ),
      ['resend A’s message by A’s address', () => b.post(`${A}/outbox/${f.messageId}/resend`), 403],
      // Club A's records through club B's own addresses: 404 (not B's).
      ['resend A’s failed message', () => b.post(`${B}/outbox/${f.messageId}/resend`), 404],
      ['change an A member', () => b.patch(`${B}/members/${holder.id}`, { concession: true }), 404],
      ['remove an A member', () => b.delete(`${B}/members/${holder.id}`), 404],
      ['take an A member’s role', () => b.delete(`${B}/members/${holder.id}/roles/plot_holder`), 404],
      ['resend A’s invite', () => b.post(`${B}/invites/${f.inviteId}/resend`), 404],
      ['cancel A’s invite', () => b.delete(`${B}/invites/${f.inviteId}`), 404],
      ['read A’s club crop', () => b.get(`${B}/crops/${f.clubCropId}`), 404],
      ['remove A’s crop relation', () => b.delete(`${B}/crops/relations/${f.clubRelationId}`), 404],
      // Records by id: 404.
      ['pay A’s fee', () => b.post(`/api/fees/${f.feeId}/payments`, { amountMinor: 100, method: 'cash', paidOn: TODAY }), 404],
      ['read an A applicant’s history', () => b.get(`/api/applications/${f.applicationId}/history`), 404],
      ['withdraw A’s offer', () => b.post(`/api/offers/${f.offerId}/withdraw`), 404],
      ['read A’s task run', () => b.get(`/api/task-runs/${f.runId}`), 404],
      // Club A's plot and applicant named in club B's own season.
      ['quote A’s plot to A’s applicant', () => b.get(`/api/seasons/${f.otherSeasonId}/offer-quote?plotId=${f.freePlot}&applicationId=${f.applicationId}`), 404],
      ['offer A’s plot to A’s applicant', () => b.post(`/api/seasons/${f.otherSeasonId}/offers`, { plotId: f.freePlot, applicationId: f.applicationId }), 400],
    ]);
    expect(await t.db('memberships').where({ club_id: f.clubId }).orderBy(['user_id', 'role']).select()).toEqual(roles);
    expect(await t.db('mail_outbox').where({ id: f.messageId }).first('status')).toEqual({ status: 'failed' });
  });
});

// ---------------------------------------------------------------------------------------------
// The matrix

describe('the authorization matrix', () => {
  it('has one table entry for every route the app has, and no entry without a route', () => {
    const keys = apiRoutes(t.app).map(routeKey);
    expect(keys.length).toBeGreaterThan(100);
    const missing = keys.filter((k) => !Object.hasOwn(AUTHORIZATION_TABLE, k));
    const stale = Object.keys(AUTHORIZATION_TABLE).filter((k) => !keys.includes(k));
    expect(missing, 'routes with no entry in authorization-matrix.table.ts').toEqual([]);
    expect(stale, 'table entries with no route in the app').toEqual([]);
    expect(Object.keys(SPECS).filter((k) => !keys.includes(k)), 'request specs with no route').toEqual([]);
    const params = new Set(keys.flatMap((k) => [...k.matchAll(/:(\w+)/g)].map((m) => m[1])));
    expect([...params].filter((p) => !(p in defaultParams(f))), 'a path parameter this test cannot fill').toEqual([]);
  });

  it('answers each route, for each role, as the table says, and shows nobody to someone who may not see them', async () => {
    const routes = apiRoutes(t.app).filter((r) => Object.hasOwn(AUTHORIZATION_TABLE, routeKey(r)));
    const failures: string[] = [];
    let checks = 0;
    for (const route of routes) {
      const key = routeKey(route);
      const entry = AUTHORIZATION_TABLE[key];
      // The roles a rule lets through go last, so a request that uses its record up does so after the refusals.
      const order = [...ROLES].sort((p, q) => Number(expected(entry, p) === 'pass') - Number(expected(entry, q) === 'pass'));
      for (const role of order) {
        const spec = (await SPECS[key]?.(f, role)) ?? {};
        const params = { ...defaultParams(f), ...spec.params };
        const url = route.path.replace(/:(\w+)/g, (_m, name: string) => encodeURIComponent(String(params[name])));
        const res = await send(spec.as ?? f.agents[role], route.method, url, spec);
        checks++;
        const want = expected(entry, role);
        const ok = res.status < 500 && (want === 'pass' ? ![401, 403, 404].includes(res.status) : res.status === want);
        if (!ok) {
          failures.push(`${key} as ${role} (${entry.rule}): expected ${want === 'pass' ? 'not 401/403/404' : want}, got ${res.status} ${JSON.stringify(res.body ?? '').slice(0, 160)}`);
        } else if (res.status < 300) {
          const seen = leaked(res, secretsFor(role, f));
          if (seen.length) failures.push(`${key} as ${role}: the answer shows ${seen.join(', ')}`);
        }
      }
    }
    await mailIdle();
    await taskRunsIdle(t.db);
    expect(failures).toEqual([]);
    // The look for names can find one: the coordinator's member list, read with a volunteer's eyes, names the holders.
    const members = await f.agents.coordinator.get(`/api/clubs/${f.clubId}/members`).expect(200);
    expect(leaked(members, secretsFor('volunteer', f))).toEqual(expect.arrayContaining([f.people.holder.name, f.people.holder2.email]));
    // computed: every route the table lists, once per role (5 roles).
    expect(checks).toBe(routes.length * ROLES.length);
  }, 300_000);
});
