/**
 * Where uploaded files live: one small interface, so the services never touch a disk or a bucket
 * themselves. Keys are `<folder>/<name>` (e.g. `site-backgrounds/<32 hex>.png`); the services make the
 * names (random hex) and keep them in the database, and this module refuses anything else.
 */
export interface StoredObject {
  bytes: Buffer;
  contentType: string;
  size: number;
}

export interface Storage {
  /** `local` or `s3`, for messages (the backup says whether the uploads are in its file). */
  readonly kind: 'local' | 's3';
  /** Stores the bytes under the key, replacing whatever was there. */
  put(key: string, bytes: Uint8Array, contentType: string): Promise<void>;
  /** The object's bytes and type, or null when there is none under the key. */
  get(key: string): Promise<StoredObject | null>;
  /** Removes the object; removing one that is not there is not an error. */
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
}

// One folder level of lower-case words, then a file name of letters, digits, dot, dash and underscore
// that does not start with a dot: nothing here can climb out of the upload folder or name a hidden file.
const KEY = /^[a-z0-9-]+\/[A-Za-z0-9_-][A-Za-z0-9._-]{0,127}$/;

/** Throws unless the key has the shape this module stores (see KEY). */
export function assertKey(key: string): void {
  if (!KEY.test(key) || key.includes('..')) throw new Error(`Not a storage key: ${JSON.stringify(key)}`);
}

export const storageKey = (folder: string, name: string) => `${folder}/${name}`;

const TYPES: Record<string, string> = { png: 'image/png', jpg: 'image/jpeg', jpeg: 'image/jpeg', webp: 'image/webp' };

/** The content type a key's extension names (the local store keeps no other record of it). */
export function contentTypeOf(key: string): string {
  const ext = key.slice(key.lastIndexOf('.') + 1).toLowerCase();
  return TYPES[ext] ?? 'application/octet-stream';
}
