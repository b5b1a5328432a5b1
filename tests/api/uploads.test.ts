import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import sharp from 'sharp';
import type { Response } from 'supertest';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { buildClub } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { waitForMail } from '../helpers/inbox';
import { findUrls } from '../../fake-mail/links';

// Every upload route (site backgrounds, observation photos, shift done photos, signed in and by link)
// against OWASP ASVS 4.0.3 V12.1 (size limits), V12.2.1 (type by content, not by name or header),
// V12.5.2 / V14.4.4 (served with its own type and nosniff) and V8.3.x (no location kept in EXIF).
// site-backgrounds.test.ts and plot-book.test.ts already cover text files, 20000² headers, EXIF of
// backgrounds and who may read what; this file adds the rest, for every route.
const root = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-uploads-'));
const uploadDir = path.join(root, 'uploads');
const t = setupTestApp({ UPLOAD_DIR: uploadDir });
afterAll(async () => {
  await t.close();
  fs.rmSync(root, { recursive: true, force: true });
});
beforeEach(async () => {
  await truncateAll(t.db);
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

/** Every file under the upload folder, any sub-folder. */
const storedFiles = (): string[] => (fs.existsSync(uploadDir) ? (fs.readdirSync(uploadDir, { recursive: true }) as string[]).filter((f) => fs.statSync(path.join(uploadDir, f)).isFile()) : []);

const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);
const pngChunk = (type: string, data: Buffer) => {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
};
/** A PNG signature and an IHDR claiming the size, with one tiny IDAT (W3C PNG Specification, 3rd ed., §5.2, §11.2.1). */
const pngBomb = (width: number, height: number) =>
  Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', Buffer.concat([be32(width), be32(height), Buffer.from([8, 2, 0, 0, 0])])),
    pngChunk('IDAT', zlib.deflateSync(Buffer.alloc(1024))),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
/** A camera-like JPEG with a GPS position in its EXIF (EXIF 2.32 GPS IFD tags, as sharp writes them). */
const gpsJpeg = () =>
  sharp({ create: { width: 640, height: 480, channels: 3, background: '#6a8f3c' } })
    .jpeg()
    .withExif({ IFD0: { Make: 'TestCam', Model: 'Field 1' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
    .toBuffer();

/** Files that are not pictures, sent with a picture's name and content type. */
const impostors: Array<[string, Buffer]> = [
  // A PDF starts "%PDF-" (ISO 32000-1, §7.5.2).
  ['a PDF named .jpg', Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n')],
  ['an HTML page named .jpg', Buffer.from('<!doctype html><html><body><script>alert(document.cookie)</script></body></html>')],
  ['an SVG with a script named .jpg', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')],
  // A GIF is an image, but not one of the three types kept (GIF89a signature).
  ['a GIF named .jpg', Buffer.from('GIF89a\x01\x00\x01\x00\x80\x00\x00\xff\xff\xff\x00\x00\x00!\xf9\x04\x01\x00\x00\x00\x00,\x00\x00\x00\x00\x01\x00\x01\x00\x00\x02\x02D\x01\x00;', 'latin1')],
];

interface Route {
  name: string;
  field: string;
  /** Bytes over this are refused (server/services/site-backgrounds.ts, observations.ts). */
  maxBytes: number;
  send(file: Buffer, filename: string): Promise<Response>;
  /** What the database holds about stored pictures, which must not change on a refusal. */
  rows(): Promise<unknown>;
}

async function club() {
  const c = await buildClub(t.db, { name: 'Upload Lane Growers' });
  await t.db('clubs').where({ id: c.id }).update({ time_zone: 'UTC' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const holder = await signedInMember(t, c.id, ['plot_holder']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const otherVolunteer = await signedInMember(t, c.id, ['volunteer']);
  const outsider = await signedInMember(t, (await buildClub(t.db, { name: 'Elsewhere' })).id, ['coordinator', 'volunteer']);
  const [site] = await t.db('sites').insert({ club_id: c.id, name: 'Field', latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20 }).returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'U-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: Number(localToday('UTC').slice(0, 4)) }).returning('id');
  await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.person.id, source: 'manual' });
  const obs = await holder.post(`/api/plots/${plot.id}/observations`, { pestSlug: 'slugs', severity: 'moderate', observedOn: localToday('UTC') });
  expect(obs.status, JSON.stringify(obs.body)).toBe(201);
  return { club: c, coordinator, holder, volunteer, otherVolunteer, outsider, siteId: site.id as number, observationId: obs.body.id as number };
}
type Club = Awaited<ReturnType<typeof club>>;

/** A shift whose day has come (its times moved to the last hour), with `who` holding a place. */
async function shiftUnderWay(s: Club, who: Agent, opts: { started: boolean }) {
  const res = await s.coordinator.post(`/api/clubs/${s.club.id}/shifts`, {
    siteId: s.siteId, title: 'Path weeding', kind: 'weed', date: addCalendarDays(localToday('UTC'), 3), startTime: '09:00', endTime: '10:00', capacity: 4, estHours: 1, instructions: '', taskIds: [],
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const since = Date.now();
  expect((await who.post(`/api/shifts/${res.body.id}/claim`)).status).toBe(200);
  const mail = await waitForMail(mailUrl(), { to: (who as Agent & { person: { email: string } }).person.email, subject: 'You have a place', after: since });
  if (opts.started) {
    const now = Date.now();
    await t.db('shifts').where({ id: res.body.id }).update({ on_date: localToday('UTC'), starts_at: new Date(now - 2 * 3600_000), ends_at: new Date(now - 3600_000) });
  }
  return { shiftId: res.body.id as number, links: findUrls(mail.text).filter((u) => u.includes('/shift-link?token=')).map((u) => new URL(u).searchParams.get('token')!) };
}

const binary = (req: ReturnType<Agent['agent']['get']>) =>
  req.buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });

function routes(s: Club, shiftId: number): Route[] {
  const post = (c: Agent, url: string, field: string, file: Buffer, filename: string) =>
    c.agent.post(url).set('X-CSRF-Token', c.csrf).attach(field, file, { filename, contentType: 'image/jpeg' });
  return [
    {
      name: 'site background', field: 'image', maxBytes: 5 * 1024 * 1024,
      send: (f, n) => post(s.coordinator, `/api/sites/${s.siteId}/background`, 'image', f, n),
      rows: () => t.db('sites').where({ id: s.siteId }).first('background_file', 'version'),
    },
    {
      name: 'observation photo', field: 'photo', maxBytes: 8 * 1024 * 1024,
      send: (f, n) => post(s.holder, `/api/observations/${s.observationId}/photos`, 'photo', f, n),
      rows: () => t.db('observation_photos').select('id'),
    },
    {
      name: 'shift done photo', field: 'photo', maxBytes: 8 * 1024 * 1024,
      send: (f, n) => post(s.volunteer, `/api/shifts/${shiftId}/done`, 'photo', f, n).field('note', 'x'),
      rows: () => t.db('shift_claims').select('status', 'photo_path'),
    },
  ];
}

describe('every upload route', () => {
  it('refuses a PDF, an HTML page, an SVG and a GIF sent as image/jpeg with a .jpg name (400 on the field), keeping nothing', async () => {
    const s = await club();
    const { shiftId } = await shiftUnderWay(s, s.volunteer, { started: true });
    for (const r of routes(s, shiftId)) {
      const before = await r.rows();
      for (const [what, bytes] of impostors) {
        const res = await r.send(bytes, 'holiday.jpg');
        expect(res.status, `${r.name}: ${what}`).toBe(400);
        expect(res.body.error.code).toBe('validation_failed');
        expect(Object.keys(res.body.error.fields), `${r.name}: ${what}`).toEqual([r.field]);
        expect(res.body.error.fields[r.field]).toMatch(/use a PNG, JPEG or WebP image$/);
      }
      expect(await r.rows(), r.name).toEqual(before);
    }
    expect(storedFiles()).toEqual([]);
  });

  it('refuses a file one byte over the limit, keeping nothing', async () => {
    const s = await club();
    const { shiftId } = await shiftUnderWay(s, s.volunteer, { started: true });
    const picture = await gpsJpeg();
    for (const r of routes(s, shiftId)) {
      const before = await r.rows();
      // A real JPEG padded after its end marker: only its length is wrong.
      const big = Buffer.concat([picture, Buffer.alloc(r.maxBytes + 1 - picture.length)]);
      const res = await r.send(big, 'big.jpg');
      expect(res.status, r.name).toBe(400);
      expect(res.body.error.fields[r.field], r.name).toMatch(/larger than [58] MB/);
      expect(await r.rows(), r.name).toEqual(before);
    }
    expect(storedFiles()).toEqual([]);
  });

  it('refuses a tiny PNG that claims 30000 × 30000 pixels without decoding it', async () => {
    const s = await club();
    const { shiftId } = await shiftUnderWay(s, s.volunteer, { started: true });
    const bomb = pngBomb(30_000, 30_000);
    expect(bomb.length).toBeLessThan(200);
    const rssBefore = process.memoryUsage().rss;
    for (const r of routes(s, shiftId)) {
      const started = Date.now();
      const res = await r.send(bomb, 'tiny.jpg');
      expect(res.status, r.name).toBe(400);
      expect(res.body.error.fields[r.field], r.name).toMatch(/^The image is 30000 × 30000 pixels/);
      expect(Date.now() - started, r.name).toBeLessThan(2000);
    }
    // computed: decoding would need 30000 × 30000 × 3 bytes ≈ 2.7 GB; refused from the header, memory hardly moves.
    expect(process.memoryUsage().rss - rssBefore).toBeLessThan(256 * 1024 * 1024);
    expect(storedFiles()).toEqual([]);
  });
});

describe('stored pictures', () => {
  /** True when the bytes still carry EXIF, or any GPS or camera words from the upload. */
  const carriesMetadata = async (bytes: Buffer) => {
    const meta = await sharp(bytes).metadata();
    return Boolean(meta.exif || meta.xmp || meta.iptc) || /Exif|GPS|TestCam|Field 1/.test(bytes.toString('latin1'));
  };

  it('observation photos and shift done photos keep no EXIF or GPS, and are served as image/webp with nosniff', async () => {
    const s = await club();
    const photo = await gpsJpeg();
    expect(await carriesMetadata(photo)).toBe(true); // the test file does carry them

    const obs = await s.holder.agent.post(`/api/observations/${s.observationId}/photos`).set('X-CSRF-Token', s.holder.csrf).attach('photo', photo, { filename: 'slug.jpg', contentType: 'image/jpeg' });
    expect(obs.status, JSON.stringify(obs.body)).toBe(201);
    const { shiftId } = await shiftUnderWay(s, s.volunteer, { started: true });
    const done = await s.volunteer.agent.post(`/api/shifts/${shiftId}/done`).set('X-CSRF-Token', s.volunteer.csrf).field('note', 'Paths weeded').attach('photo', photo, { filename: 'paths.jpg', contentType: 'image/jpeg' });
    expect(done.status, JSON.stringify(done.body)).toBe(200);

    const files = storedFiles();
    expect(files).toHaveLength(3); // computed: the observation photo, its thumbnail, the done photo
    for (const f of files) expect(await carriesMetadata(fs.readFileSync(path.join(uploadDir, f))), f).toBe(false);

    const claim = await t.db('shift_claims').where({ shift_id: shiftId, user_id: s.volunteer.person.id }).first('id');
    for (const [who, url] of [
      [s.holder, obs.body.photos[0].url],
      [s.holder, obs.body.photos[0].thumbUrl],
      [s.volunteer, `/api/shifts/${shiftId}/claims/${claim.id}/photo`],
      [s.coordinator, `/api/shifts/${shiftId}/claims/${claim.id}/photo`],
    ] as const) {
      const res = await binary(who.agent.get(url));
      expect(res.status, url).toBe(200);
      expect(res.headers['content-type'], url).toBe('image/webp');
      expect(res.headers['x-content-type-options'], url).toBe('nosniff');
      expect(await carriesMetadata(res.body as Buffer), url).toBe(false);
    }
  });

  it('a done photo is shown to its sender and the coordinators only', async () => {
    const s = await club();
    const { shiftId } = await shiftUnderWay(s, s.volunteer, { started: true });
    await s.volunteer.agent.post(`/api/shifts/${shiftId}/done`).set('X-CSRF-Token', s.volunteer.csrf).attach('photo', await gpsJpeg(), 'paths.jpg').expect(200);
    const claim = await t.db('shift_claims').where({ shift_id: shiftId }).first('id');
    const url = `/api/shifts/${shiftId}/claims/${claim.id}/photo`;
    expect((await s.otherVolunteer.get(url)).status).toBe(404);
    expect((await s.holder.get(url)).status).toBe(404);
    expect((await s.outsider.get(url)).status).toBe(404);
    expect((await (await browserLikeAgent(t.app)).get(url)).status).toBe(401);
    expect((await s.coordinator.get(url)).status).toBe(200);
  });

  it('a done that is refused (the shift has not started) keeps no photo, signed in or by link', async () => {
    const s = await club();
    const { shiftId, links } = await shiftUnderWay(s, s.volunteer, { started: false });
    const photo = await gpsJpeg();
    const signedIn = await s.volunteer.agent.post(`/api/shifts/${shiftId}/done`).set('X-CSRF-Token', s.volunteer.csrf).attach('photo', photo, 'early.jpg');
    expect(signedIn.status).toBe(409);
    expect(storedFiles()).toEqual([]);
    const anon = await browserLikeAgent(t.app);
    let refused = 0;
    for (const token of links) {
      const res = await anon.agent.post('/api/shift-links/done').set('X-CSRF-Token', anon.csrf).field('token', token).attach('photo', photo, 'early.jpg');
      if (res.status === 409) refused++;
    }
    expect(refused).toBe(1); // the done link; the release link is "for something else" (400)
    expect(storedFiles()).toEqual([]);
    expect(await t.db('shift_claims').where({ shift_id: shiftId }).pluck('photo_path')).toEqual([null]);
  });

  it('a done photo sent again replaces the first, whose file goes', async () => {
    const s = await club();
    const { shiftId } = await shiftUnderWay(s, s.volunteer, { started: true });
    const send = async () =>
      s.volunteer.agent.post(`/api/shifts/${shiftId}/done`).set('X-CSRF-Token', s.volunteer.csrf).attach('photo', await gpsJpeg(), 'paths.jpg').expect(200);
    await send();
    const first = await t.db('shift_claims').where({ shift_id: shiftId }).first('photo_path');
    await send();
    const second = await t.db('shift_claims').where({ shift_id: shiftId }).first('photo_path');
    expect(second.photo_path).not.toBe(first.photo_path);
    expect(storedFiles()).toEqual([path.join('shift-photos', second.photo_path)]);
  });
});
