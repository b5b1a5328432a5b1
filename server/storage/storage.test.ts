import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeS3 } from '../../tests/helpers/fake-s3';
import { loadConfig } from '../config';
import { createStorage, diskStorage, s3Storage, type Storage } from '.';

const name = (ext: string) => `${crypto.randomBytes(16).toString('hex')}.${ext}`;
const bytes = (n: number) => crypto.randomBytes(n);

// Keys that must never reach a disk path or a bucket: climbing out, absolute, hidden, nested, empty.
const badKeys = ['../etc/passwd', 'site-backgrounds/../../x.png', '/tmp/x.png', 'site-backgrounds/.hidden', 'a/b/c.png', 'x.png', '', 'Upper/x.png'];

/** What every store must do, whatever keeps the bytes. */
function contract(label: string, make: () => Storage) {
  describe(`${label}: the storage contract`, () => {
    it('gives back the bytes put under a key, with the content type, and says the key exists', async () => {
      const s = make();
      const key = `site-backgrounds/${name('png')}`;
      const data = bytes(70_000);
      expect(await s.exists(key)).toBe(false);
      await s.put(key, data, 'image/png');
      expect(await s.exists(key)).toBe(true);
      const got = await s.get(key);
      expect(got).not.toBeNull();
      expect(Buffer.compare(got!.bytes, data)).toBe(0);
      expect(got!.size).toBe(data.length);
      expect(got!.contentType).toBe('image/png');
    });

    it('replaces on a second put, and deletes (a second delete, or one of a key never stored, is no error)', async () => {
      const s = make();
      const key = `observation-photos/${name('webp')}`;
      await s.put(key, bytes(10), 'image/webp');
      const second = bytes(20);
      await s.put(key, second, 'image/webp');
      expect(Buffer.compare((await s.get(key))!.bytes, second)).toBe(0);
      await s.delete(key);
      expect(await s.exists(key)).toBe(false);
      expect(await s.get(key)).toBeNull();
      await s.delete(key);
      await s.delete(`shift-photos/${name('webp')}`);
    });

    it('answers null for a key never stored', async () => {
      expect(await make().get(`shift-photos/${name('webp')}`)).toBeNull();
    });

    it('refuses keys that are not one folder and a plain file name', async () => {
      const s = make();
      for (const key of badKeys) {
        await expect(s.put(key, bytes(1), 'image/png'), key).rejects.toThrow(/Not a storage key/);
        await expect(s.get(key), key).rejects.toThrow(/Not a storage key/);
        await expect(s.exists(key), key).rejects.toThrow(/Not a storage key/);
        await expect(s.delete(key), key).rejects.toThrow(/Not a storage key/);
      }
    });
  });
}

describe('local disk storage', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-storage-'));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));
  contract('local', () => diskStorage(dir));

  it('keeps the layout uploads always had: <upload dir>/<folder>/<name>, folder 0700, file 0600, nothing else left', async () => {
    const s = diskStorage(dir);
    const file = name('jpg');
    const data = bytes(1234);
    await s.put(`site-backgrounds/${file}`, data, 'image/jpeg');
    const onDisk = path.join(dir, 'site-backgrounds', file);
    expect(Buffer.compare(fs.readFileSync(onDisk), data)).toBe(0);
    expect(fs.statSync(path.join(dir, 'site-backgrounds')).mode & 0o777).toBe(0o700);
    expect(fs.statSync(onDisk).mode & 0o777).toBe(0o600);
    expect(fs.readdirSync(path.join(dir, 'site-backgrounds')).filter((f) => f.endsWith('.part'))).toEqual([]);
  });

  it('reads a file written before the storage interface existed (by path, not through put)', async () => {
    const file = name('webp');
    fs.mkdirSync(path.join(dir, 'observation-photos'), { recursive: true });
    fs.writeFileSync(path.join(dir, 'observation-photos', file), 'older upload');
    const got = await diskStorage(dir).get(`observation-photos/${file}`);
    expect(got?.bytes.toString()).toBe('older upload');
    // The local store knows a file's type by its extension only.
    expect(got?.contentType).toBe('image/webp');
  });

  it('is what the configuration gives by default', async () => {
    const s = createStorage(loadConfig({ DATABASE_URL: 'postgres://postgres@127.0.0.1:5432/x', UPLOAD_DIR: dir }));
    expect(s.kind).toBe('local');
    const key = `shift-photos/${name('webp')}`;
    await s.put(key, bytes(5), 'image/webp');
    expect(fs.existsSync(path.join(dir, 'shift-photos', key.split('/')[1]))).toBe(true);
  });
});

describe('S3 storage against a fake S3 server (@20minutes/s3rver)', () => {
  let fake: Awaited<ReturnType<typeof startFakeS3>>;
  beforeAll(async () => {
    fake = await startFakeS3();
  });
  afterAll(() => fake?.close());
  contract('s3', () => s3Storage(fake.settings));

  it('keeps the content type it was given, whatever the key says', async () => {
    const s = s3Storage(fake.settings);
    const key = `site-backgrounds/${name('bin')}`;
    await s.put(key, bytes(3), 'image/png');
    expect((await s.get(key))?.contentType).toBe('image/png');
  });

  it('is what STORAGE=s3 gives, and a wrong secret is an error, not a missing file', async () => {
    const { endpoint, bucket } = fake.settings;
    const env = { DATABASE_URL: 'postgres://postgres@127.0.0.1:5432/x', STORAGE: 's3', S3_ENDPOINT: endpoint!, S3_BUCKET: bucket, S3_ACCESS_KEY_ID: 'S3RVER' };
    const s = createStorage(loadConfig({ ...env, S3_SECRET_ACCESS_KEY: 'S3RVER' }));
    expect(s.kind).toBe('s3');
    const key = `shift-photos/${name('webp')}`;
    await s.put(key, bytes(8), 'image/webp');
    expect(await s.exists(key)).toBe(true);
    const wrong = createStorage(loadConfig({ ...env, S3_SECRET_ACCESS_KEY: 'not-the-secret' }));
    await expect(wrong.get(key)).rejects.toThrow(/signature/i);
  });
});

describe('storage settings', () => {
  const base = { DATABASE_URL: 'postgres://postgres@127.0.0.1:5432/x' };
  it('needs a bucket for STORAGE=s3, both halves of a key pair, and an http(s) endpoint', () => {
    expect(() => loadConfig({ ...base, STORAGE: 's3' })).toThrow(/S3_BUCKET: is required when STORAGE=s3/);
    expect(() => loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'photos', S3_ACCESS_KEY_ID: 'k' })).toThrow(/S3_SECRET_ACCESS_KEY/);
    expect(() => loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'photos', S3_ENDPOINT: 'ftp://x' })).toThrow(/S3_ENDPOINT/);
    expect(() => loadConfig({ ...base, STORAGE: 'gcs' })).toThrow(/STORAGE/);
  });
  it('uses path-style addresses for a named endpoint and virtual-host ones for AWS unless told', () => {
    const named = loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'photos', S3_ENDPOINT: 'http://127.0.0.1:9000' }).storage;
    const aws = loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'photos', S3_REGION: 'eu-west-2' }).storage;
    expect(named).toMatchObject({ kind: 's3', forcePathStyle: true, region: 'us-east-1' });
    expect(aws).toMatchObject({ kind: 's3', forcePathStyle: false, region: 'eu-west-2', endpoint: undefined });
    expect(loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'photos', S3_ENDPOINT: 'http://h', S3_FORCE_PATH_STYLE: 'false' }).storage).toMatchObject({ forcePathStyle: false });
  });
});
