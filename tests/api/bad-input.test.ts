import zlib from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '@shared/errors';
import { createFeeForAllocation } from '../../server/services/fee-charges';
import { buildApplication, buildClub, buildMember } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';
import { rowCounts } from '../helpers/row-counts';

// Each probe is one bad input that once answered 500; each must now answer a 4xx in the error shape,
// naming the field where there is one.

const t = setupTestApp();

interface Fixture {
  c: Agent;
  anon: Agent;
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
let before: Record<string, number>;

beforeAll(async () => {
  await truncateAll(t.db);
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const site = (await c.post(`/api/clubs/${club.id}/sites`, siteBody).expect(201)).body;
  const plot = (await c.post(`/api/sites/${site.id}/plots`, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 }).expect(201)).body;
  // A second, free plot, so offers get past "the plot is held" to the fields under test.
  const freePlot = (await c.post(`/api/sites/${site.id}/plots`, { label: 'A-2', x: 5, y: 0, width: 3, length: 6 }).expect(201)).body;
  // A fee with something owed, so payments get past "more than is owed" to the fields under test.
  await c
    .put(`/api/clubs/${club.id}/fee-schedule`, {
      basis: 'kind',
      areaUnit: 'm2',
      rateMinorPerArea: 0,
      priceInGroundMinor: 4000,
      priceRaisedBedMinor: 0,
      priceContainerMinor: 0,
      priceSharedBedMinor: 0,
      concessionPercent: 0,
      depositMinor: 0,
    })
    .expect(200);
  const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
  const application = await buildApplication(t.db, { clubId: club.id });
  const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
  const feeId = await t.db.transaction(async (trx) => {
    const [a] = await trx('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.id, source: 'manual' }).returning('id');
    return createFeeForAllocation(trx, { allocationId: a.id });
  });
  f = {
    c,
    anon: await browserLikeAgent(t.app),
    clubId: club.id,
    slug: club.slug,
    siteId: site.id,
    plotId: plot.id,
    freePlotId: freePlot.id,
    applicationId: application.id,
    seasonId: season.id,
    feeId,
  };
  before = await rowCounts(t.db);
});
afterAll(() => t.close());

const siteBody = { name: 'North field', latitude: 51.5, longitude: -0.12, timeZone: 'Europe/London', width: 40, length: 30 };
const plotBody = { label: 'B-1', x: 10, y: 10, width: 3, length: 6 };
const payment = { amountMinor: 100, method: 'cash', paidOn: '2026-11-20' };
const mailing = { subject: 'Hello', body: 'Water is back on.', audience: { kind: 'all_members' } };
const application = { name: 'Ada Applicant', email: 'ada@example.org' };
// PostgreSQL's integer columns hold at most 2^31 − 1 (PostgreSQL manual, "Numeric Types", table 8.2).
const TOO_BIG_ID = 2147483648;
const NUL = '\u0000';

/** A 100-byte PNG whose header claims 16384 × 16384 pixels (W3C PNG Specification, 3rd ed., §11.2.1 IHDR). */
function hugePng(): Buffer {
  const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
  };
  const head = Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', Buffer.concat([be32(16384), be32(16384), Buffer.from([8, 2, 0, 0, 0])])),
  ]);
  return Buffer.concat([head, chunk('IDAT', Buffer.alloc(100 - head.length - 12 - 12, 0)), chunk('IEND', Buffer.alloc(0))]);
}

type Send = (x: Fixture) => Promise<request.Response> | request.Test;

interface Probe {
  name: string;
  send: Send;
  status: number | number[];
  /** The key expected in error.fields. */
  field?: string;
}

const raw = (x: Fixture, method: 'post' | 'patch', url: string) =>
  x.c.agent[method](url).set('X-CSRF-Token', x.c.csrf);

const probes: Probe[] = [
  // Ids past the integer columns' range.
  { name: 'GET a plot with id 2^31', send: (x) => x.c.get(`/api/plots/${TOO_BIG_ID}`), status: [400, 404] },
  { name: 'PATCH a plot with id 2^31', send: (x) => x.c.patch(`/api/plots/${TOO_BIG_ID}`, { version: 1 }), status: [400, 404] },
  { name: 'GET a site with id 2^31', send: (x) => x.c.get(`/api/sites/${TOO_BIG_ID}`), status: [400, 404] },
  { name: 'GET a site with id 10^20', send: (x) => x.c.get('/api/sites/100000000000000000000/plots'), status: [400, 404] },
  { name: 'GET a club with id 2^31', send: (x) => x.c.get(`/api/clubs/${TOO_BIG_ID}/sites`), status: [400, 404] },
  { name: 'GET a season with id 2^31', send: (x) => x.c.get(`/api/seasons/${TOO_BIG_ID}`), status: [400, 404] },
  { name: 'pay a fee with id 2^31', send: (x) => x.c.post(`/api/fees/${TOO_BIG_ID}/payments`, payment), status: [400, 404] },
  { name: 'withdraw an offer with id 2^31', send: (x) => x.c.post(`/api/offers/${TOO_BIG_ID}/withdraw`), status: [400, 404] },
  {
    name: 'move an application with id 2^31',
    send: (x) => x.c.post(`/api/applications/${TOO_BIG_ID}/move`, { toPosition: 1, reason: 'Asked to' }),
    status: [400, 404],
  },
  {
    name: 'apply anonymously with preferredSiteId 2^31',
    send: (x) => x.anon.post(`/api/apply/${x.slug}`, { ...application, preferredSiteId: TOO_BIG_ID }),
    status: [400, 404],
    field: 'preferredSiteId',
  },
  {
    name: 'waitlist filtered by siteId 2^31',
    send: (x) => x.c.get(`/api/clubs/${x.clubId}/waitlist?siteId=${TOO_BIG_ID}`),
    status: 400,
    field: 'siteId',
  },
  {
    name: 'plot states of siteId 2^31',
    send: (x) => x.c.get(`/api/seasons/${x.seasonId}/plot-states?siteId=${TOO_BIG_ID}`),
    status: 400,
    field: 'siteId',
  },
  {
    name: 'offer plotId 2^31',
    send: (x) => x.c.post(`/api/seasons/${x.seasonId}/offers`, { plotId: TOO_BIG_ID, applicationId: x.applicationId }),
    status: 400,
    field: 'plotId',
  },
  {
    name: 'offer applicationId 2^31',
    send: (x) => x.c.post(`/api/seasons/${x.seasonId}/offers`, { plotId: x.freePlotId, applicationId: TOO_BIG_ID }),
    status: 400,
    field: 'applicationId',
  },
  {
    name: 'mailing to site 2^31',
    send: (x) => x.c.post(`/api/clubs/${x.clubId}/mailings`, { ...mailing, audience: { kind: 'site', siteId: TOO_BIG_ID, year: 2027 } }),
    status: 400,
    field: 'audience.siteId',
  },
  {
    name: 'plot PATCH with version 2^31',
    send: (x) => x.c.patch(`/api/plots/${x.plotId}`, { version: TOO_BIG_ID, notes: 'x' }),
    status: 400,
    field: 'version',
  },
  {
    name: 'site PATCH with version 2^31',
    send: (x) => x.c.patch(`/api/sites/${x.siteId}`, { version: TOO_BIG_ID, name: 'x' }),
    status: 400,
    field: 'version',
  },
  {
    name: 'plot DELETE with version 2^31',
    send: (x) => x.c.delete(`/api/plots/${x.plotId}?version=${TOO_BIG_ID}`),
    status: 400,
    field: 'version',
  },
  {
    name: 'waitlist move to position 2^31',
    send: (x) => x.c.post(`/api/applications/${x.applicationId}/move`, { toPosition: TOO_BIG_ID, reason: 'Asked to' }),
    status: 400,
    field: 'toPosition',
  },
  {
    name: 'members page 10^20',
    send: (x) => x.c.get(`/api/clubs/${x.clubId}/members?page=100000000000000000000`),
    status: 400,
    field: 'page',
  },

  // NUL in text fields.
  { name: 'site name with NUL', send: (x) => x.c.post(`/api/clubs/${x.clubId}/sites`, { ...siteBody, name: `North${NUL}` }), status: 400, field: 'name' },
  {
    name: 'site address with NUL',
    send: (x) => x.c.post(`/api/clubs/${x.clubId}/sites`, { ...siteBody, name: 'S2', address: `1 Lane${NUL}` }),
    status: 400,
    field: 'address',
  },
  {
    name: 'site soil notes with NUL',
    send: (x) => x.c.patch(`/api/sites/${x.siteId}`, { version: 1, soilNotes: `Clay${NUL}` }),
    status: 400,
    field: 'soilNotes',
  },
  { name: 'club name with NUL', send: (x) => x.c.patch(`/api/clubs/${x.clubId}`, { name: `Club${NUL}` }), status: 400, field: 'name' },
  {
    name: 'invite name with NUL',
    send: (x) => x.c.post(`/api/clubs/${x.clubId}/invites`, { email: 'new@example.org', name: `New${NUL}`, roles: ['volunteer'] }),
    status: 400,
    field: 'name',
  },
  {
    name: 'accepting an invite with a NUL name',
    send: (x) => x.anon.post('/api/invites/accept', { token: 'a'.repeat(40), name: `Me${NUL}`, password: 'long enough pass' }),
    status: 400,
    field: 'name',
  },
  { name: 'plot notes with NUL', send: (x) => x.c.post(`/api/sites/${x.siteId}/plots`, { ...plotBody, notes: `Tap${NUL}` }), status: 400, field: 'notes' },
  { name: 'plot PATCH notes with NUL', send: (x) => x.c.patch(`/api/plots/${x.plotId}`, { version: 1, notes: `a${NUL}b` }), status: 400, field: 'notes' },
  { name: 'mailing subject with NUL', send: (x) => x.c.post(`/api/clubs/${x.clubId}/mailings`, { ...mailing, subject: `Hi${NUL}` }), status: 400, field: 'subject' },
  { name: 'mailing body with NUL', send: (x) => x.c.post(`/api/clubs/${x.clubId}/mailings`, { ...mailing, body: `Hi${NUL}` }), status: 400, field: 'body' },
  { name: 'payment note with NUL', send: (x) => x.c.post(`/api/fees/${x.feeId}/payments`, { ...payment, note: `Paid${NUL}` }), status: 400, field: 'note' },
  {
    name: 'plot CSV with NUL',
    send: (x) =>
      x.c.post(`/api/sites/${x.siteId}/plot-imports`, {
        csv: `label,x,y,width,length,notes\nC-1,20,0,3,6,ok\nC-2,25,0,3,6,bad${NUL}\n`,
        units: 'metric',
        commit: true,
      }),
    status: 400,
    field: 'csv',
  },
  {
    name: 'members CSV with NUL',
    send: (x) =>
      x.c.post(`/api/clubs/${x.clubId}/member-imports`, { csv: `name,email\nNul${NUL} Person,nul@example.org\n`, commit: true }),
    status: 400,
    field: 'csv',
  },
  {
    name: 'waitlist CSV with NUL (preview)',
    send: (x) =>
      x.c.post(`/api/clubs/${x.clubId}/waitlist-imports`, { csv: `name,email,notes\nWait,w@example.org,a${NUL}\n`, commit: false }),
    status: 400,
    field: 'csv',
  },
  { name: 'application name with NUL', send: (x) => x.anon.post(`/api/apply/${x.slug}`, { ...application, name: `Ada${NUL}` }), status: 400, field: 'name' },
  { name: 'application notes with NUL', send: (x) => x.anon.post(`/api/apply/${x.slug}`, { ...application, notes: `Hi${NUL}` }), status: 400, field: 'notes' },
  {
    name: 'waitlist move reason with NUL',
    send: (x) => x.c.post(`/api/applications/${x.applicationId}/move`, { toPosition: 1, reason: `Asked${NUL}` }),
    status: 400,
    field: 'reason',
  },
  { name: 'club slug with NUL', send: (x) => x.anon.get('/api/apply/ab%00cd'), status: [400, 404] },

  // Bodies and paths the parsers refuse.
  {
    name: 'JSON in iso-8859-1',
    send: (x) => raw(x, 'post', `/api/clubs/${x.clubId}/sites`).set('Content-Type', 'application/json; charset=iso-8859-1').send(JSON.stringify(siteBody)),
    status: 415,
  },
  {
    name: 'unknown Content-Encoding',
    send: (x) =>
      raw(x, 'post', `/api/clubs/${x.clubId}/sites`).set('Content-Type', 'application/json').set('Content-Encoding', 'bogus').send(JSON.stringify(siteBody)),
    status: 415,
  },
  {
    name: 'gzip Content-Encoding on a plain body',
    send: (x) =>
      raw(x, 'post', `/api/clubs/${x.clubId}/sites`).set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send(JSON.stringify(siteBody)),
    status: 400,
  },
  { name: 'malformed percent-encoding in a plot path', send: (x) => x.c.get('/api/plots/%E0%A4%A'), status: 400 },
  { name: 'malformed percent-encoding in a site path', send: (x) => x.c.patch('/api/sites/%E0%A4%A', { version: 1 }), status: 400 },

  // Numbers and dates the database cannot hold, or that make no sense.
  { name: 'site width 1e-320', send: (x) => x.c.post(`/api/clubs/${x.clubId}/sites`, { ...siteBody, name: 'S3', width: 1e-320 }), status: 400, field: 'width' },
  { name: 'site length 1e-9', send: (x) => x.c.post(`/api/clubs/${x.clubId}/sites`, { ...siteBody, name: 'S4', length: 1e-9 }), status: 400, field: 'length' },
  { name: 'site PATCH width 1e-320', send: (x) => x.c.patch(`/api/sites/${x.siteId}`, { version: 1, width: 1e-320 }), status: 400, field: 'width' },
  {
    name: 'site background scale 1e-9',
    send: (x) => x.c.patch(`/api/sites/${x.siteId}`, { version: 1, backgroundMetresPerPixel: 1e-9 }),
    status: 400,
    field: 'backgroundMetresPerPixel',
  },
  { name: 'plot width 1e-9', send: (x) => x.c.post(`/api/sites/${x.siteId}/plots`, { ...plotBody, width: 1e-9 }), status: 400, field: 'width' },
  { name: 'plot length 1e-9', send: (x) => x.c.post(`/api/sites/${x.siteId}/plots`, { ...plotBody, length: 1e-9 }), status: 400, field: 'length' },
  { name: 'plot PATCH width 1e-9', send: (x) => x.c.patch(`/api/plots/${x.plotId}`, { version: 1, width: 1e-9 }), status: 400, field: 'width' },
  { name: 'plot soil depth 1e-9', send: (x) => x.c.post(`/api/sites/${x.siteId}/plots`, { ...plotBody, soilDepth: 1e-9 }), status: 400, field: 'soilDepth' },
  {
    name: 'plot soil tested on 0000-01-01',
    send: (x) => x.c.post(`/api/sites/${x.siteId}/plots`, { ...plotBody, soilTestedOn: '0000-01-01' }),
    status: 400,
    field: 'soilTestedOn',
  },
  {
    name: 'plot CSV width 1e-9',
    send: (x) =>
      x.c.post(`/api/sites/${x.siteId}/plot-imports`, { csv: 'label,x,y,width,length\nD-1,20,0,1e-9,6\n', units: 'metric', commit: true }),
    status: 400,
    field: 'row 2.width',
  },
  { name: 'payment dated 0000-01-01', send: (x) => x.c.post(`/api/fees/${x.feeId}/payments`, { ...payment, paidOn: '0000-01-01' }), status: 400, field: 'paidOn' },
  { name: 'payment dated 9999-12-31', send: (x) => x.c.post(`/api/fees/${x.feeId}/payments`, { ...payment, paidOn: '9999-12-31' }), status: 400, field: 'paidOn' },
  {
    name: 'season renewal deadline in year 0',
    send: (x) => x.c.post(`/api/clubs/${x.clubId}/seasons`, { year: 2028, renewalDeadline: '0000-01-01T00:00:00Z' }),
    status: 400,
    field: 'renewalDeadline',
  },
  {
    name: 'offer deadline in year 0',
    send: (x) =>
      x.c.post(`/api/seasons/${x.seasonId}/offers`, { plotId: x.freePlotId, applicationId: x.applicationId, deadline: '0000-01-01T00:00:00Z' }),
    status: 400,
    field: 'deadline',
  },
  {
    name: 'waitlist CSV applied on 0000-01-01',
    send: (x) =>
      x.c.post(`/api/clubs/${x.clubId}/waitlist-imports`, { csv: 'name,email,applied_on\nOld,old@example.org,0000-01-01\n', commit: true }),
    status: 400,
    field: 'row 2.applied_on',
  },

  // Sizes of lists and images.
  {
    name: 'invite with 100,000 roles',
    send: (x) =>
      x.c.post(`/api/clubs/${x.clubId}/invites`, { email: 'many@example.org', name: 'Many', roles: Array.from({ length: 100_000 }, () => 'volunteer') }),
    status: 400,
    field: 'roles',
  },
  {
    name: 'invite with a repeated role',
    send: (x) => x.c.post(`/api/clubs/${x.clubId}/invites`, { email: 'twice@example.org', name: 'Twice', roles: ['volunteer', 'volunteer'] }),
    status: 400,
    field: 'roles',
  },
  {
    name: 'PNG declaring 16384 × 16384 pixels in 100 bytes',
    send: (x) =>
      x.c.agent
        .post(`/api/sites/${x.siteId}/background`)
        .set('X-CSRF-Token', x.c.csrf)
        .attach('image', hugePng(), { filename: 'huge.png', contentType: 'image/png' }),
    status: 400,
    field: 'image',
  },
];

describe('bad input answers a 4xx in the error shape, never a 500', () => {
  it('builds a 100-byte PNG for the pixel-count probe', () => {
    expect(hugePng().length).toBe(100);
  });

  it.each(probes.map((p) => [p.name, p] as const))('%s', async (_name, probe) => {
    const res = await probe.send(f);
    const allowed = Array.isArray(probe.status) ? probe.status : [probe.status];
    expect(allowed, `answered ${res.status}: ${JSON.stringify(res.body)}`).toContain(res.status);
    expect(ErrorBodySchema.safeParse(res.body).success, JSON.stringify(res.body)).toBe(true);
    if (probe.field) expect(Object.keys(res.body.error.fields ?? {})).toContain(probe.field);
  });

  it('left the fixture as it was: no refused probe wrote a row', async () => {
    expect(await rowCounts(t.db)).toEqual(before);
  });
});
