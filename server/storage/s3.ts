import type { S3Client } from '@aws-sdk/client-s3';
import { assertKey, type Storage, type StoredObject } from './storage';

export interface S3Settings {
  /** An S3-compatible server's address; left out for AWS itself (the region picks the endpoint). */
  endpoint?: string;
  bucket: string;
  region: string;
  /** Both or neither; with neither, the SDK's usual chain (environment, instance role) supplies them. */
  accessKeyId?: string;
  secretAccessKey?: string;
  /** `https://host/bucket/key` rather than `https://bucket.host/key`: what most S3-compatible servers want. */
  forcePathStyle: boolean;
}

const notFound = (err: unknown) => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
};

// The SDK takes about 0.2 s to load, so a server that keeps its uploads on disk never loads it.
let sdk: Promise<typeof import('@aws-sdk/client-s3')> | null = null;
const loadSdk = () => (sdk ??= import('@aws-sdk/client-s3'));

/** Objects in one bucket under the same keys as the local folder's paths. The bucket must exist and be private. */
export function s3Storage(settings: S3Settings): Storage {
  let client: Promise<{ s3: S3Client; sdk: typeof import('@aws-sdk/client-s3') }> | null = null;
  const open = () => (client ??= loadSdk().then((m) => ({ sdk: m, s3: makeClient(m, settings) })));
  const Bucket = settings.bucket;
  return {
    kind: 's3',
    async put(key, bytes, contentType) {
      assertKey(key);
      const { s3, sdk: m } = await open();
      await s3.send(new m.PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }));
    },
    async get(key): Promise<StoredObject | null> {
      assertKey(key);
      const { s3, sdk: m } = await open();
      try {
        const res = await s3.send(new m.GetObjectCommand({ Bucket, Key: key }));
        const bytes = Buffer.from(await res.Body!.transformToByteArray());
        return { bytes, contentType: res.ContentType ?? 'application/octet-stream', size: bytes.length };
      } catch (err) {
        if (notFound(err)) return null;
        throw err;
      }
    },
    async delete(key) {
      assertKey(key);
      const { s3, sdk: m } = await open();
      await s3.send(new m.DeleteObjectCommand({ Bucket, Key: key }));
    },
    async exists(key) {
      assertKey(key);
      const { s3, sdk: m } = await open();
      try {
        await s3.send(new m.HeadObjectCommand({ Bucket, Key: key }));
        return true;
      } catch (err) {
        if (notFound(err)) return false;
        throw err;
      }
    },
  };
}

function makeClient(m: typeof import('@aws-sdk/client-s3'), settings: S3Settings): S3Client {
  return new m.S3Client({
    endpoint: settings.endpoint,
    region: settings.region,
    forcePathStyle: settings.forcePathStyle,
    credentials:
      settings.accessKeyId && settings.secretAccessKey
        ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
        : undefined,
    // Checksums only where S3 requires them: some S3-compatible servers refused the ones the SDK began sending
    // by default in early 2025 (from memory; not seen with the fake server used in the tests).
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
}
