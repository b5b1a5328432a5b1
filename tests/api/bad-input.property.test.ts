import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ErrorBodySchema } from '@shared/errors';
import { createFeeForAllocation } from '../../server/services/fee-charges';
import { buildApplication, buildClub, buildMember } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';
import { rowCounts } from '../helpers/row-counts';
import { apiRoutes } from '../helpers/routes';

// Every JSON route, found by walking the app's own router, gets seeded random bodies, queries and path
// values from a coordinator with a CSRF token: none may answer 5xx, every 4xx carries the error shape,
// and a refused request writes nothing. The routes come from tests/helpers/routes.ts (`apiRoutes`).

// The public form allows 5 applications an hour per address by default; this test sends more.
const t = setupTestApp({ APPLY_RATE_LIMIT: '100000' });

// Routes that take no input and would succeed, ending the session or removing the fixture's site for
// the requests after them. Named exactly, so a renamed route fails the check below instead of slipping out.
const SKIPPED = new Set(['DELETE /api/session', 'DELETE /api/sites/:siteId']);

// ---------------------------------------------------------------------------------------------
// Field names, from every object schema in shared/schemas, so a new field is tried too.

type ZodDef = { type: string; shape?: Record<string, z.ZodType>; innerType?: z.ZodType; element?: z.ZodType; options?: z.ZodType[]; in?: z.ZodType; out?: z.ZodType };

function collectKeys(schema: z.ZodType, keys: Set<string>, seen: Set<unknown>) {
  if (seen.has(schema)) return;
  seen.add(schema);
  const def = (schema as unknown as { _zod: { def: ZodDef } })._zod.def;
  if (def.shape) {
    for (const [k, v] of Object.entries(def.shape)) {
      keys.add(k);
      collectKeys(v, keys, seen);
    }
  }
  for (const inner of [def.innerType, def.element, def.in, def.out, ...(def.options ?? [])]) {
    if (inner) collectKeys(inner, keys, seen);
  }
}

const schemaModules = import.meta.glob<Record<string, unknown>>(['/shared/schemas/*.ts', '!/shared/schemas/*.test.ts'], { eager: true }); // the project's own shared/, from the root
const fieldNames = (() => {
  const keys = new Set<string>();
  const seen = new Set<unknown>();
  for (const mod of Object.values(schemaModules)) {
    for (const value of Object.values(mod)) if (value instanceof z.ZodType) collectKeys(value, keys, seen);
  }
  return [...keys].sort();
})();

// ---------------------------------------------------------------------------------------------
// Values: the shapes of bad input that have broken APIs before, and plausible ones to get past the
// first check.

const nastyNumber = fc.constantFrom(
  2147483648, // one past the integer columns (PostgreSQL manual, "Numeric Types")
  2147483647,
  -2147483649,
  2 ** 53 + 2, // past the doubles that hold every integer
  1e308,
  -1e308,
  1e-320, // a denormal double: positive, yet stored as 0
  1e-9,
  -1,
  0,
  -0,
  0.5,
  1,
  3,
  2027,
);
const nastyString = fc.constantFrom(
  '',
  ' ',
  '\u0000',
  'a\u0000b',
  '\u0007bell',
  'line\nbreak',
  '\ud800', // a lone surrogate
  'x'.repeat(5000),
  '0000-01-01',
  '9999-12-31',
  '2027-02-30',
  '2027-03-14',
  '0000-01-01T00:00:00Z',
  '2027-03-14T10:00:00Z',
  '2147483648',
  '-1',
  '1e-320',
  'NaN',
  'volunteer',
  'coordinator',
  'metric',
  'members',
  'waitlist',
  'all_members',
  'site',
  'season',
  'cash',
  'a@example.org',
  'label,x,y,width,length\nZ-1,0,0,1e-9,6\n',
  'name,email,notes\nA,a@example.org,x\u0000\n',
  "'; drop table plots; --",
  '../../etc/passwd',
  '%E0%A4%A',
);
const leaf: fc.Arbitrary<unknown> = fc.oneof(nastyNumber, nastyString, fc.boolean(), fc.constant(null), fc.string({ maxLength: 12 }), fc.integer());
const value: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: leaf },
  { weight: 1, arbitrary: fc.array(leaf, { maxLength: 4 }) },
  { weight: 1, arbitrary: fc.constant(Array.from({ length: 5000 }, () => 'volunteer')) },
  { weight: 1, arbitrary: fc.dictionary(fc.constantFrom(...fieldNames), leaf, { maxKeys: 3 }) },
);
const bodyArb: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: fc.dictionary(fc.constantFrom(...fieldNames), value, { minKeys: 1, maxKeys: 8 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
);
/** The values that most often got past a schema to the database: each must be refused by the schema. */
const killer: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(
    2147483648,
    99999999999,
    1e-320,
    1e-9,
    -1,
    '\u0000',
    'a\u0000b',
    'x\u0007y',
    '0000-01-01',
    '9999-12-31',
    '0000-01-01T00:00:00Z',
    'x'.repeat(25_000),
  ),
  fc.constant(Array.from({ length: 5000 }, () => 'volunteer')),
);

// Query names the routes read, tried more often than the body field names.
const queryNames = ['page', 'pageSize', 'year', 'status', 'siteId', 'version', 'units', 'kind', 'token', 'needs', 'severity', 'seasonId', 'date', 'x', 'width', 'from', 'to'];
const queryArb = fc.dictionary(
  fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...queryNames) }, { weight: 1, arbitrary: fc.constantFrom(...fieldNames) }),
  fc.oneof(
    // Long values stay out of the address: Node itself answers 431 to an oversized request line.
    { weight: 2, arbitrary: killer.filter((v) => typeof v !== 'object' && String(v).length < 1000).map(String) },
    { weight: 1, arbitrary: fc.oneof(nastyString, nastyNumber.map(String), fc.string({ maxLength: 8 })) },
  ),
  { maxKeys: 3 },
);

// Bodies that pass the schema, for the routes that write the most, so mutations reach the services.
const validBodies: Record<string, (x: Fixture) => Record<string, unknown>> = {
  'POST /api/clubs/:clubId/sites': () => ({ name: 'Fuzz field', latitude: 51.5, longitude: -0.1, timeZone: 'Europe/London', width: 40, length: 30 }),
  'PATCH /api/sites/:siteId': () => ({ version: 1, name: 'Renamed' }),
  'POST /api/sites/:siteId/plots': () => ({ label: 'F-1', x: 30, y: 20, width: 3, length: 6 }),
  'PATCH /api/plots/:plotId': () => ({ version: 1, notes: 'Fine' }),
  'POST /api/fees/:feeId/payments': () => ({ amountMinor: 100, method: 'cash', paidOn: '2026-11-20' }),
  'POST /api/clubs/:clubId/invites': () => ({ email: 'fuzz@example.org', name: 'Fuzz', roles: ['volunteer'] }),
  'POST /api/apply/:clubSlug': () => ({ name: 'Fuzz Applicant', email: 'fuzz-applicant@example.org' }),
  'POST /api/clubs/:clubId/mailings': () => ({ subject: 'Hello', body: 'Hi', audience: { kind: 'all_members' } }),
  'POST /api/seasons/:seasonId/offers': (x) => ({ plotId: x.freePlotId, applicationId: x.applicationId }),
  'POST /api/applications/:applicationId/move': () => ({ toPosition: 1, reason: 'Asked to' }),
  'PUT /api/clubs/:clubId/fee-schedule': () => ({ ...feeSchedule }),
  'PATCH /api/clubs/:clubId': () => ({ name: 'Renamed club' }),
  'POST /api/clubs/:clubId/seasons': () => ({ year: 2028, renewalDeadline: '2027-12-01T12:00:00Z' }),
  'POST /api/sites/:siteId/plot-imports': () => ({ csv: 'label,x,y,width,length\nI-1,35,0,3,6\n', units: 'metric', commit: false }),
  'POST /api/clubs/:clubId/member-imports': () => ({ csv: 'name,email,roles\nM,m@example.org,volunteer\n', commit: false }),
  'POST /api/clubs/:clubId/waitlist-imports': () => ({ csv: 'name,email\nW,w@example.org\n', commit: false }),
  'POST /api/clubs/:clubId/crops': () => ({
    commonName: 'Fuzz bean',
    botanicalName: { value: 'Vicia faba', source: 'from-memory' },
    family: { value: 'Fabaceae', source: 'from-memory' },
    kind: 'legume',
    sowing: { value: 'direct', source: 'from-memory' },
    daysToMaturity: { value: { min: 80, max: 100, from: 'sowing' }, source: 'from-memory' },
  }),
  'PUT /api/clubs/:clubId/crops/:cropId/overrides/:field': () => ({ value: { min: 30, max: 40, from: 'sowing' }, source: 'from-memory' }),
  // Crop 1 is a reference crop (loaded after every truncation); the part lies inside the fixture's plot.
  'POST /api/plots/:plotId/plantings': () => ({ cropId: 1, method: 'sown', plantedOn: '2026-11-20', part: { x: 0, y: 0, width: 1, length: 2 } }),
  'POST /api/plots/:plotId/plantings/check': () => ({ cropId: 1, method: 'sown', plantedOn: '2026-11-20', part: { x: 0, y: 0, width: 1, length: 2 } }),
  'POST /api/plots/:plotId/observations': () => ({ pestSlug: 'clubroot', severity: 'light', observedOn: '2026-11-20', part: { x: 0, y: 0, width: 1, length: 2 } }),
  // The weather log: a gauge entry on a past day, and a file checked without saving.
  'PUT /api/sites/:siteId/weather/:day': () => ({ rainMm: 4.5, tMinC: 3, tMaxC: 11, source: 'gauge' }),
  'POST /api/sites/:siteId/weather-imports': () => ({ csv: 'date,t_min,t_max,rain\n2026-06-01,9,18,2.5\n', units: 'metric', duplicates: 'skip', commit: false }),
  // A shift five days from now at the fixture's site, with no tasks; a volunteer's e-mail choices.
  'POST /api/clubs/:clubId/shifts': (x) => ({
    siteId: x.siteId,
    title: 'Fuzz watering',
    kind: 'water',
    date: new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 10),
    startTime: '18:00',
    endTime: '19:00',
    capacity: 2,
    estHours: 1,
    instructions: '',
    taskIds: [],
  }),
  'PUT /api/clubs/:clubId/volunteer-settings': () => ({ digestDay: 2, helpMail: false, reminders: false }),
};
const feeSchedule = {
  basis: 'kind',
  areaUnit: 'm2',
  rateMinorPerArea: 0,
  priceInGroundMinor: 4000,
  priceRaisedBedMinor: 0,
  priceContainerMinor: 0,
  priceSharedBedMinor: 0,
  concessionPercent: 0,
  depositMinor: 0,
};

// ---------------------------------------------------------------------------------------------
// The fixture the requests run against.

interface Fixture {
  c: Agent;
  clubId: number;
  slug: string;
  siteId: number;
  plotId: number;
  freePlotId: number;
  applicationId: number;
  seasonId: number;
  feeId: number;
}
let f: Fixture;

beforeAll(async () => {
  await truncateAll(t.db);
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const site = (await c.post(`/api/clubs/${club.id}/sites`, { name: 'North field', latitude: 51.5, longitude: -0.12, timeZone: 'Europe/London', width: 40, length: 30 }).expect(201)).body;
  const plot = (await c.post(`/api/sites/${site.id}/plots`, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 }).expect(201)).body;
  const freePlot = (await c.post(`/api/sites/${site.id}/plots`, { label: 'A-2', x: 5, y: 0, width: 3, length: 6 }).expect(201)).body;
  await c.put(`/api/clubs/${club.id}/fee-schedule`, feeSchedule).expect(200);
  const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
  const application = await buildApplication(t.db, { clubId: club.id });
  const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
  const feeId = await t.db.transaction(async (trx) => {
    const [a] = await trx('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.id, source: 'manual' }).returning('id');
    return createFeeForAllocation(trx, { allocationId: a.id });
  });
  f = { c, clubId: club.id, slug: club.slug, siteId: site.id, plotId: plot.id, freePlotId: freePlot.id, applicationId: application.id, seasonId: season.id, feeId };
});
afterAll(() => t.close());

function paramValue(name: string, x: Fixture): string | null {
  const known: Record<string, number | string> = {
    clubId: x.clubId,
    siteId: x.siteId,
    plotId: x.plotId,
    seasonId: x.seasonId,
    feeId: x.feeId,
    applicationId: x.applicationId,
    offerId: 1,
    // Someone else's or no renewal: the signed-in answer routes then answer 404, never 5xx.
    renewalId: 999999,
    messageId: 1,
    // Records that do not exist: the destructive member and invite routes then answer 404, never 5xx.
    inviteId: 999999,
    userId: 999999,
    // Plot-book records that do not exist: their routes answer 404.
    plantingId: 999999,
    harvestId: 999999,
    observationId: 999999,
    photoId: 999999,
    role: 'volunteer',
    clubSlug: x.slug,
    // A reference crop (truncateAll loads them: ids from 1) and a field the overrides allow.
    cropId: 1,
    field: 'daysToMaturity',
    relationId: 999999,
    // Task records that do not exist: their routes answer 404.
    taskId: 999999,
    handoverId: 999999,
    runId: 999999,
    // Shifts and places that do not exist (404), and a calendar address that is not one of ours (404).
    shiftId: 999999,
    claimId: 999999,
    file: 'not-a-feed.ics',
    // A past day of the weather log (the site's zone is London; the fixed date is before any run of this test).
    day: '2026-11-20',
    // A stop link that is not one of ours (404) and a template that exists (its preview is a GET).
    token: 'x'.repeat(43),
    name: 'offer',
  };
  return name in known ? String(known[name]) : null;
}

const badParam = fc.constantFrom('2147483648', '99999999999999999999', '0', '-1', '1.5', 'abc', '%E0%A4%A', '%00', '1e3');

/** How the body is sent: as the client sends it, or with a charset or encoding the parser refuses. */
const framing = fc.constantFrom('json', 'json', 'json', 'json', 'latin1', 'bogus-encoding', 'gzip-not-gzip', 'not-json');

// About 600 requests in all (15 routes with a valid body, about 45 others), seeded: the same each run.
// BAD_INPUT_SEED=<n> tries another sequence when hunting for new holes.
const SEED = Number(process.env.BAD_INPUT_SEED ?? 20261202);
const RUNS_WITH_VALID_BODY = 24;
const RUNS_OTHERWISE = 6;

describe('every JSON route, under random bad input', () => {
  it('finds the routes from the app and knows how to fill each path parameter', () => {
    const routes = apiRoutes(t.app);
    expect(routes.length).toBeGreaterThan(40);
    for (const s of SKIPPED) expect(routes.map((r) => `${r.method} ${r.path}`)).toContain(s);
    for (const key of Object.keys(validBodies)) expect(routes.map((r) => `${r.method} ${r.path}`)).toContain(key);
    const missing = routes.flatMap((r) => [...r.path.matchAll(/:(\w+)/g)].map((m) => m[1])).filter((p) => paramValue(p, f) === null);
    expect(missing, 'a path parameter this test cannot fill; add it to paramValue').toEqual([]);
    expect(fieldNames).toEqual(expect.arrayContaining(['name', 'notes', 'preferredSiteId', 'roles', 'paidOn', 'csv']));
  });

  it('never answers 5xx, always answers 4xx in the error shape, and writes nothing when it refuses', async () => {
    const routes = apiRoutes(t.app).filter((r) => !SKIPPED.has(`${r.method} ${r.path}`));
    let sent = 0;
    let failure = '';
    for (const [i, route] of routes.entries()) {
      const key = `${route.method} ${route.path}`;
      const valid = Object.hasOwn(validBodies, key) ? validBodies[key] : undefined;
      // Start from a valid body and spoil one or two fields, mostly its own, mostly with a killer value.
      const mutated = valid
        ? fc
            .array(
              fc.tuple(
                fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...Object.keys(valid(f))) }, { weight: 1, arbitrary: fc.constantFrom(...fieldNames) }),
                fc.oneof({ weight: 3, arbitrary: killer }, { weight: 1, arbitrary: value }),
              ),
              { minLength: 1, maxLength: 2 },
            )
            .map((pairs) => ({ ...valid(f), ...Object.fromEntries(pairs) }))
        : bodyArb;
      const body = valid ? fc.oneof({ weight: 3, arbitrary: mutated }, { weight: 1, arbitrary: bodyArb }) : bodyArb;
      const params = fc.record(
        Object.fromEntries([...route.path.matchAll(/:(\w+)/g)].map((m) => [m[1], fc.oneof({ weight: 4, arbitrary: fc.constant(paramValue(m[1], f)!) }, { weight: 1, arbitrary: badParam })])),
      );
      await fc.assert(
        fc.asyncProperty(params, body, queryArb, framing, async (ps, b, q, how) => {
          sent++;
          const url = route.path.replace(/:(\w+)/g, (_m, name: string) => (ps as Record<string, string>)[name]);
          const before = await rowCounts(t.db);
          const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
          let req = f.c.agent[method](url).set('X-CSRF-Token', f.c.csrf).query(q);
          if (method !== 'get') {
            const text = JSON.stringify(b) ?? 'null';
            if (how === 'latin1') req = req.set('Content-Type', 'application/json; charset=iso-8859-1').send(text);
            else if (how === 'bogus-encoding') req = req.set('Content-Type', 'application/json').set('Content-Encoding', 'bogus').send(text);
            else if (how === 'gzip-not-gzip') req = req.set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send(text);
            else if (how === 'not-json') req = req.set('Content-Type', 'application/json').send(`${text.slice(0, -1)},`);
            else req = req.set('Content-Type', 'application/json').send(text);
          }
          const res: request.Response = await req;
          const short = (v: unknown) => (JSON.stringify(v) ?? String(v)).slice(0, 300);
          const what = `${route.method} ${url} (${how}) query=${short(q)} body=${short(b)} → ${res.status} ${short(res.body)}`;
          failure = what;
          expect(res.status, what).toBeLessThan(500);
          if (res.status >= 400) {
            expect(ErrorBodySchema.safeParse(res.body).success, `not the error shape: ${what}`).toBe(true);
            const after = await rowCounts(t.db);
            failure = `refused, yet rows changed (${short(before)} → ${short(after)}): ${what}`;
            expect(after).toEqual(before);
          }
        }),
        {
          numRuns: valid ? RUNS_WITH_VALID_BODY : RUNS_OTHERWISE,
          seed: SEED + i,
          endOnFailure: true,
          // The request that failed, cut short; fast-check's own report would print 25 kB values in full.
          reporter: (run) => {
            if (run.failed) throw new Error(`${failure}\n(seed ${run.seed}; ${run.errorInstance instanceof Error ? run.errorInstance.message.slice(0, 300) : ''})`);
          },
        },
      );
    }
    const withBody = routes.filter((r) => Object.hasOwn(validBodies, `${r.method} ${r.path}`)).length;
    expect(sent).toBe(withBody * RUNS_WITH_VALID_BODY + (routes.length - withBody) * RUNS_OTHERWISE);
  }, 120_000);
});
