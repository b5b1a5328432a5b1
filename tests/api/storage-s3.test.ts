import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { s3Storage } from '../../server/storage';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';
import { startFakeS3 } from '../helpers/fake-s3';

// The app with STORAGE=s3 against a fake S3-compatible server: a map background goes into the bucket,
// is served from it, is replaced and removed there, and nothing is written to the upload folder.

const fake = await startFakeS3();
const uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-s3-unused-'));
const { endpoint, bucket, accessKeyId, secretAccessKey } = fake.settings;
const t = setupTestApp({
  UPLOAD_DIR: uploadDir,
  STORAGE: 's3',
  S3_ENDPOINT: endpoint!,
  S3_BUCKET: bucket,
  S3_ACCESS_KEY_ID: accessKeyId!,
  S3_SECRET_ACCESS_KEY: secretAccessKey!,
});
const bucketView = s3Storage(fake.settings);
afterAll(async () => {
  await t.close();
  await fake.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
});
beforeEach(() => truncateAll(t.db));

const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);
const chunk = (type: string, data: Buffer) => {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
};
/** A complete RGB PNG (W3C PNG Specification, 3rd ed., §5.2 signature, §11.2.1 IHDR). */
function png(width: number, height: number): Buffer {
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(width * 3, 0x55)]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', Buffer.concat([be32(width), be32(height), Buffer.from([8, 2, 0, 0, 0])])),
    chunk('IDAT', zlib.deflateSync(Buffer.concat(Array.from({ length: height }, () => row)))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('uploads in an S3 bucket (STORAGE=s3)', () => {
  it('stores, serves, replaces and removes a site background in the bucket, never on disk', async () => {
    const club = await buildClub(t.db);
    const person = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await browserLikeAgent(t.app);
    expect((await c.signIn(person.email, person.password!)).status).toBe(200);
    const site = (
      await c.post(`/api/clubs/${club.id}/sites`, { name: 'North field', latitude: 51.5, longitude: -0.1, timeZone: 'Europe/London', width: 40, length: 30, pathWidth: 0.9 }).expect(201)
    ).body as { id: number };
    const upload = (image: Buffer) => c.agent.post(`/api/sites/${site.id}/background`).set('X-CSRF-Token', c.csrf).attach('image', image, 'plan.png');

    expect((await upload(png(40, 25))).status).toBe(200);
    const first = (await t.db('sites').where({ id: site.id }).first('background_file')).background_file as string;
    const key = `site-backgrounds/${first}`;
    const stored = await bucketView.get(key);
    expect(stored?.contentType).toBe('image/png');

    const served = await c.get(`/api/sites/${site.id}/background`).buffer(true).expect(200);
    expect(served.headers['content-type']).toBe('image/png');
    expect(served.headers['cache-control']).toBe('private, max-age=3600');
    expect(Buffer.compare(served.body as Buffer, stored!.bytes)).toBe(0);
    // A browser that has it already gets 304 for the same ETag.
    await c.get(`/api/sites/${site.id}/background`).set('If-None-Match', served.headers.etag).expect(304);

    expect((await upload(png(20, 20))).status).toBe(200);
    const second = (await t.db('sites').where({ id: site.id }).first('background_file')).background_file as string;
    expect(second).not.toBe(first);
    expect(await bucketView.exists(key)).toBe(false);
    expect(await bucketView.exists(`site-backgrounds/${second}`)).toBe(true);

    await c.delete(`/api/sites/${site.id}/background`).expect(204);
    expect(await bucketView.exists(`site-backgrounds/${second}`)).toBe(false);
    expect((await c.get(`/api/sites/${site.id}/background`)).status).toBe(404);
    expect(fs.readdirSync(uploadDir)).toEqual([]);
  });
});
