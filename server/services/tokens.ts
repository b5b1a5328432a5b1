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

/**
 * Whether two secrets (CSRF tokens, signatures) are the same, in time that does not depend on where
 * they first differ. Both sides are hashed to 32 bytes first: `timingSafeEqual` throws on buffers of
 * different lengths, and two strings of one length can differ in UTF-8 bytes (a header's "é"), so
 * comparing raw buffers turned such a header into a 500. An empty secret never matches.
 */
export function sameSecret(a: string, b: string): boolean {
  if (typeof a !== 'string' || typeof b !== 'string' || a.length === 0 || b.length === 0) return false;
  const digest = (s: string) => crypto.createHash('sha256').update(s, 'utf8').digest();
  return crypto.timingSafeEqual(digest(a), digest(b));
}
