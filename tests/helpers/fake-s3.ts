import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from '@20minutes/s3rver';
import type { S3Settings } from '../../server/storage';

/**
 * A fake S3-compatible server on loopback (@20minutes/s3rver, pure JS, files in a temp folder) with one
 * bucket made up front: the SDK's CreateBucket sends `PUT /bucket/`, whose signature this server checks
 * against `/bucket` and refuses, and Tillwell never creates buckets anyway.
 */
export async function startFakeS3(bucket = 'tillwell-test') {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-fake-s3-'));
  const server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory, configureBuckets: [{ name: bucket }] });
  const { port } = await server.run();
  const settings: S3Settings = {
    endpoint: `http://127.0.0.1:${port}`,
    bucket,
    region: 'us-east-1',
    // s3rver's one built-in key pair (lib/models/account.js: DUMMY_ACCOUNT.createKeyPair('S3RVER', 'S3RVER')).
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    forcePathStyle: true,
  };
  return {
    settings,
    directory,
    async close() {
      await server.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
