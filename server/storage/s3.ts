import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
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

/** Objects in one bucket under the same keys as the local folder's paths. The bucket must exist and be private. */
export function s3Storage(settings: S3Settings): Storage {
  const client = new S3Client({
    endpoint: settings.endpoint,
    region: settings.region,
    forcePathStyle: settings.forcePathStyle,
    credentials:
      settings.accessKeyId && settings.secretAccessKey
        ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
        : undefined,
    // Checksums only where S3 requires them: several S3-compatible servers refuse the newer default ones.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = settings.bucket;
  return {
    kind: 's3',
    async put(key, bytes, contentType) {
      assertKey(key);
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }));
    },
    async get(key): Promise<StoredObject | null> {
      assertKey(key);
      try {
        const res = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        const bytes = Buffer.from(await res.Body!.transformToByteArray());
        return { bytes, contentType: res.ContentType ?? 'application/octet-stream', size: bytes.length };
      } catch (err) {
        if (notFound(err)) return null;
        throw err;
      }
    },
    async delete(key) {
      assertKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
    async exists(key) {
      assertKey(key);
      try {
        await client.send(new HeadObjectCommand({ Bucket, Key: key }));
        return true;
      } catch (err) {
        if (notFound(err)) return false;
        throw err;
      }
    },
  };
}
