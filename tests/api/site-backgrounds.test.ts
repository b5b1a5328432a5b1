import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

// The upload folder sits under a dot-folder, as the default .data/uploads does, to prove files are still served.
const root = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-bg-'));
const uploadDir = path.join(root, '.data', 'uploads');
const storedDir = path.join(uploadDir, 'site-backgrounds');
const t = setupTestApp({ UPLOAD_DIR: uploadDir });
afterAll(async () => {
  await t.close();
  fs.rmSync(root, { recursive: true, force: true });
});
beforeEach(async () => {
  await truncateAll(t.db);
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

type Agent = Awaited<ReturnType<typeof browserLikeAgent>>;

const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);
function pngChunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
}

/** A complete RGB PNG (W3C PNG Specification, 3rd ed., §5.2 signature, §11.2.1 IHDR). */
function png(width: number, height: number): Buffer {
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(width * 3, 0x55)]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', Buffer.concat([be32(width), be32(height), Buffer.from([8, 2, 0, 0, 0])])),
    pngChunk('IDAT', zlib.deflateSync(Buffer.concat(Array.from({ length: height }, () => row)))),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

/** A JPEG header with a baseline frame of the given size and no image data (ITU-T T.81 Annex B.2.2). */
function jpegHeaderOnly(width: number, height: number): Buffer {
  const seg = (m: number, body: number[]) => [0xff, m, 0, body.length + 2, ...body];
  return Buffer.from([
    0xff, 0xd8,
    ...seg(0xe0, [0x4a, 0x46, 0x49, 0x46, 0, 1, 1, 0, 0, 1, 0, 1, 0, 0]),
    ...seg(0xc0, [8, height >> 8, height & 255, width >> 8, width & 255, 1, 1, 0x11, 0]),
    0xff, 0xd9,
  ]);
}

/** A decodable JPEG, optionally carrying a GPS position in its EXIF as a phone writes it. */
const jpeg = (width: number, height: number, opts: { gps?: boolean } = {}) => {
  const picture = sharp({ create: { width, height, channels: 3, background: '#6a8f3c' } }).jpeg();
  return (opts.gps ? picture.withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1' } }) : picture).toBuffer();
};

async function signedIn(clubId: number, roles: Role[]) {
  const person = await buildMember(t.db, { clubId, roles });
  const c = await browserLikeAgent(t.app);
  expect((await c.signIn(person.email, person.password!)).status).toBe(200);
  return c;
}

async function coordinatorWithSite() {
  const club = await buildClub(t.db);
  const c = await signedIn(club.id, ['coordinator']);
  const res = await c.post(`/api/clubs/${club.id}/sites`, {
    name: 'North field',
    latitude: 51.5,
    longitude: -0.1,
    timeZone: 'Europe/London',
    width: 40,
    length: 30,
    pathWidth: 0.9,
  });
  expect(res.status).toBe(201);
  return { club, c, site: res.body as { id: number; version: number } };
}

const upload = (c: Agent, siteId: number, file: Buffer, name: string, fields: Record<string, string> = {}) => {
  let req = c.agent.post(`/api/sites/${siteId}/background`).set('X-CSRF-Token', c.csrf);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('image', file, name);
};

const storedFiles = () => (fs.existsSync(storedDir) ? fs.readdirSync(storedDir) : []);

describe('site background image', () => {
  it('stores an uploaded PNG re-encoded under a random name, records its size and scale, and serves the stored bytes', async () => {
    const { c, site } = await coordinatorWithSite();
    const image = png(40, 25);
    const res = await upload(c, site.id, image, 'plan.png', { widthMetres: '40' });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(site.version + 1);
    expect(res.body.background).toEqual({
      url: `/api/sites/${site.id}/background?v=${site.version + 1}`,
      widthPx: 40,
      heightPx: 25,
      metresPerPixel: 1, // 40 m across 40 pixels
    });
    const files = storedFiles();
    expect(files).toHaveLength(1);
    expect(files[0]).toMatch(/^[0-9a-f]{32}\.png$/);
    const stored = fs.readFileSync(path.join(storedDir, files[0]));
    const meta = await sharp(stored).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 40, 25]);

    const got = await c.get(res.body.background.url);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    expect(got.headers['cache-control']).toBe('private, max-age=3600');
    expect(Buffer.compare(got.body as Buffer, stored)).toBe(0);
  });

  it('leaves the scale empty without a width, and replaces the previous image, deleting its file', async () => {
    const { c, site } = await coordinatorWithSite();
    await upload(c, site.id, png(8, 8), 'first.png').expect(200);
    const first = storedFiles();
    const res = await upload(c, site.id, await jpeg(1600, 1200), 'second.jpg');
    expect(res.status).toBe(200);
    expect(res.body.background).toMatchObject({ widthPx: 1600, heightPx: 1200, metresPerPixel: null });
    const now = storedFiles();
    expect(now).toHaveLength(1);
    expect(now[0]).toMatch(/\.jpg$/);
    expect(now).not.toEqual(first);
    const got = await c.get(`/api/sites/${site.id}/background`);
    expect(got.headers['content-type']).toBe('image/jpeg');
  });

  it('shrinks a large plan to 4096 px and keeps the scale of the measured width', async () => {
    const { c, site } = await coordinatorWithSite();
    const plan = await sharp({ create: { width: 6000, height: 1500, channels: 3, background: '#ffffff' } }).png().toBuffer();
    const res = await upload(c, site.id, plan, 'plan.png', { widthMetres: '60' });
    expect(res.status).toBe(200);
    expect(res.body.background).toMatchObject({ widthPx: 4096, heightPx: 1024 });
    // 60 m across the stored 4096 px (the column keeps 6 decimals), not across the 6000 px uploaded.
    expect(res.body.background.metresPerPixel).toBeCloseTo(60 / 4096, 6);
    const meta = await sharp(fs.readFileSync(path.join(storedDir, storedFiles()[0]))).metadata();
    expect([meta.width, meta.height]).toEqual([4096, 1024]);
  });

  it('stores a phone JPEG without its EXIF, so the GPS position is not kept', async () => {
    const { c, site } = await coordinatorWithSite();
    const photo = await jpeg(800, 600, { gps: true });
    expect((await sharp(photo).metadata()).exif).toBeDefined();
    await upload(c, site.id, photo, 'ground.jpg').expect(200);
    const stored = fs.readFileSync(path.join(storedDir, storedFiles()[0]));
    expect((await sharp(stored).metadata()).exif).toBeUndefined();
  });

  it('refuses a JPEG whose header is sound but which holds no picture, and keeps nothing', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await upload(c, site.id, jpegHeaderOnly(1600, 1200), 'empty.jpg');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ image: 'The image looks damaged: it could not be decoded' });
    expect(storedFiles()).toEqual([]);
  });

  it('refuses a text file renamed .png, by its content, and keeps nothing', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await upload(c, site.id, Buffer.from('label,x,y\nA-1,0,0\n'), 'plan.png');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields).toEqual({ image: 'The file is not an image we can read; use a PNG, JPEG or WebP image' });
    expect(storedFiles()).toEqual([]);
    expect((await c.get(`/api/sites/${site.id}`)).body).toMatchObject({ background: null, version: site.version });
  });

  it('refuses a file over 5 MB with the standard error body', async () => {
    const { c, site } = await coordinatorWithSite();
    const big = Buffer.concat([png(1, 1), Buffer.alloc(5 * 1024 * 1024)]);
    const res = await upload(c, site.id, big, 'huge.png');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({
      error: {
        code: 'validation_failed',
        message: 'The image is larger than 5 MB',
        fields: { image: 'The image is larger than 5 MB' },
      },
    });
    expect(storedFiles()).toEqual([]);
  });

  it('asks for the image in the "image" field and checks the width', async () => {
    const { c, site } = await coordinatorWithSite();
    const none = await c.agent.post(`/api/sites/${site.id}/background`).set('X-CSRF-Token', c.csrf).field('widthMetres', '10');
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toEqual({ image: 'Choose a PNG, JPEG or WebP image' });

    const wrongField = await c.agent
      .post(`/api/sites/${site.id}/background`)
      .set('X-CSRF-Token', c.csrf)
      .attach('photo', png(2, 2), 'a.png');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.fields).toEqual({ image: 'Send the image in the form field "image"' });

    const cutOff = await c.agent
      .post(`/api/sites/${site.id}/background`)
      .set('X-CSRF-Token', c.csrf)
      .set('Content-Type', 'multipart/form-data; boundary=xyz')
      .send('--xyz\r\nContent-Disposition: form-data; name="image"; filename="a.png"\r\n\r\n\x89PNG');
    expect(cutOff.status).toBe(400);
    expect(cutOff.body.error.fields).toEqual({ image: 'The upload could not be read; try again' });

    const badWidth = await upload(c, site.id, png(2, 2), 'a.png', { widthMetres: '-3' });
    expect(badWidth.status).toBe(400);
    expect(badWidth.body.error.fields).toEqual({ widthMetres: 'Must be more than 0' });
    expect(storedFiles()).toEqual([]);
  });

  it('lets any member of the club see the image, only a coordinator change it, and nobody else know the site exists', async () => {
    const { club, c, site } = await coordinatorWithSite();
    await upload(c, site.id, png(4, 4), 'plan.png').expect(200);

    const holder = await signedIn(club.id, ['plot_holder']);
    expect((await holder.get(`/api/sites/${site.id}/background`)).status).toBe(200);
    expect((await upload(holder, site.id, png(4, 4), 'mine.png')).status).toBe(403);
    expect((await holder.delete(`/api/sites/${site.id}/background`)).status).toBe(403);

    const outsider = await signedIn((await buildClub(t.db)).id, ['coordinator']);
    const seen = await outsider.get(`/api/sites/${site.id}/background`);
    expect(seen.status).toBe(404);
    expect(seen.body.error.code).toBe('not_found');
    expect((await upload(outsider, site.id, png(4, 4), 'theirs.png')).status).toBe(404);
    expect((await outsider.delete(`/api/sites/${site.id}/background`)).status).toBe(404);
    expect(storedFiles()).toHaveLength(1);
  });

  it('removes the image: 204, then the file and the columns are gone and fetching it answers 404', async () => {
    const { c, site } = await coordinatorWithSite();
    const up = await upload(c, site.id, png(4, 4), 'plan.png', { widthMetres: '2' });
    expect(up.body.background.metresPerPixel).toBe(0.5);
    await c.delete(`/api/sites/${site.id}/background`).expect(204);
    expect(storedFiles()).toEqual([]);
    const row = await t.db('sites').where({ id: site.id }).first();
    expect(row).toMatchObject({
      background_file: null,
      background_mime: null,
      background_width_px: null,
      background_height_px: null,
      background_m_per_px: null,
      version: up.body.version + 1,
    });
    const gone = await c.get(`/api/sites/${site.id}/background`);
    expect(gone.status).toBe(404);
    expect(gone.headers['cache-control']).not.toBe('private, max-age=3600');
    expect((await c.delete(`/api/sites/${site.id}/background`)).status).toBe(404);
  });
});
