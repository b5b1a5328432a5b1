import type { Config } from '../config';
import { diskStorage } from './local';
import { s3Storage } from './s3';
import type { Storage } from './storage';

export { assertKey, contentTypeOf, storageKey, type Storage, type StoredObject } from './storage';
export { diskStorage } from './local';
export { s3Storage, type S3Settings } from './s3';

/** The store the configuration names: the upload folder on this machine (default) or an S3 bucket. */
export function createStorage(config: Pick<Config, 'storage'>): Storage {
  return config.storage.kind === 's3' ? s3Storage(config.storage) : diskStorage(config.storage.dir);
}
