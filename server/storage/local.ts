import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { assertKey, contentTypeOf, type Storage, type StoredObject } from './storage';

/**
 * Files under one folder, in the layout Tillwell has always used (`<uploadDir>/<folder>/<name>`), so
 * existing uploads keep working. Each key's folder is private (0700) and each file 0600; parents such as
 * .data stay as the system makes them. The content type is the extension's (see contentTypeOf).
 */
export function diskStorage(uploadDir: string): Storage {
  const root = path.resolve(uploadDir);
  const fileOf = (key: string) => {
    assertKey(key);
    return path.join(root, ...key.split('/'));
  };
  const missing = (err: unknown) => {
    const code = (err as NodeJS.ErrnoException).code;
    return code === 'ENOENT' || code === 'EISDIR' || code === 'ENOTDIR';
  };
  return {
    kind: 'local',
    async put(key, bytes) {
      const file = fileOf(key);
      const folder = path.dirname(file);
      await fs.mkdir(path.dirname(folder), { recursive: true });
      await fs.mkdir(folder, { recursive: true, mode: 0o700 });
      // Written beside the target and renamed over it, so a reader never sees half a file.
      const temp = path.join(folder, `.${crypto.randomBytes(6).toString('hex')}.part`);
      try {
        await fs.writeFile(temp, bytes, { flag: 'wx', mode: 0o600 });
        await fs.rename(temp, file);
      } catch (err) {
        await fs.rm(temp, { force: true });
        throw err;
      }
    },
    async get(key): Promise<StoredObject | null> {
      try {
        const bytes = await fs.readFile(fileOf(key));
        return { bytes, contentType: contentTypeOf(key), size: bytes.length };
      } catch (err) {
        if (missing(err)) return null;
        throw err;
      }
    },
    async delete(key) {
      await fs.rm(fileOf(key), { force: true });
    },
    async exists(key) {
      try {
        return (await fs.stat(fileOf(key))).isFile();
      } catch (err) {
        if (missing(err)) return false;
        throw err;
      }
    },
  };
}
