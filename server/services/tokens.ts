import crypto from 'node:crypto';

/** A fresh single-use link token and the hash stored in place of it. */
export function newToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** The SHA-256 hex of a token; only hashes are stored, so a database leak reveals no live link. */
export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
