import crypto from 'node:crypto';

// Mail waiting in the outbox carries live links (invitations, password resets, offers, shift
// links), whose tokens are otherwise kept only as hashes. The bodies are therefore sealed with
// AES-256-GCM under a key derived from the session secret, so the database alone (a backup, a
// read-only leak) reveals no working link. The key lives in the process, never in the database.

const PREFIX = 'sealed:v1:';
let key: Buffer | null = null;

/** Derives the outbox key from the session secret (HKDF-SHA256); createApp calls it once. */
export function useMailSealSecret(secret: string): void {
  key = Buffer.from(crypto.hkdfSync('sha256', secret, 'tillwell', 'mail-outbox-body-v1', 32));
}

function currentKey(): Buffer {
  if (!key) throw new Error('The outbox key is not set: call useMailSealSecret(config.sessionSecret) first (createApp does).');
  return key;
}

/** "sealed:v1:" and base64url of a random 12-byte IV, the 16-byte tag and the ciphertext. */
export function sealText(plain: string): string {
  const iv = crypto.randomBytes(12);
  const cipher = crypto.createCipheriv('aes-256-gcm', currentKey(), iv);
  const body = Buffer.concat([cipher.update(plain, 'utf8'), cipher.final()]);
  return PREFIX + Buffer.concat([iv, cipher.getAuthTag(), body]).toString('base64url');
}

/** The text `sealText` sealed; throws when it was sealed under another key or changed. */
export function openText(sealed: string): string {
  if (!sealed.startsWith(PREFIX)) throw new Error('This outbox value is not sealed.');
  const raw = Buffer.from(sealed.slice(PREFIX.length), 'base64url');
  const decipher = crypto.createDecipheriv('aes-256-gcm', currentKey(), raw.subarray(0, 12));
  decipher.setAuthTag(raw.subarray(12, 28));
  return Buffer.concat([decipher.update(raw.subarray(28)), decipher.final()]).toString('utf8');
}

/** Whether a stored value is sealed (rows written before sealing are plain). */
export const isSealed = (value: unknown): value is string => typeof value === 'string' && value.startsWith(PREFIX);
