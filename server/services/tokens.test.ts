import crypto from 'node:crypto';
import { describe, expect, it, vi } from 'vitest';
import { hashToken, newToken, sameSecret } from './tokens';

describe('newToken', () => {
  it('gives 256 random bits as base64url and stores only their SHA-256', () => {
    const { token, hash } = newToken();
    // computed: 32 bytes → ceil(32 × 8 / 6) = 43 base64url characters, no padding.
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    expect(hash).toBe(crypto.createHash('sha256').update(token).digest('hex'));
    expect(hash).not.toContain(token);
  });

  it('never repeats itself over 2,000 tokens', () => {
    const seen = new Set(Array.from({ length: 2000 }, () => newToken().token));
    expect(seen.size).toBe(2000);
  });

  it('hashes the same token the same way every time', () => {
    const { token } = newToken();
    expect(hashToken(token)).toBe(hashToken(token));
    expect(hashToken(token)).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('sameSecret', () => {
  it('says equal only for equal, non-empty secrets', () => {
    const { token } = newToken();
    expect(sameSecret(token, `${token}`)).toBe(true);
    expect(sameSecret(token, token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A'))).toBe(false);
    expect(sameSecret(token, token.slice(1))).toBe(false);
    expect(sameSecret(token, `${token}x`)).toBe(false);
    expect(sameSecret('', '')).toBe(false);
    expect(sameSecret(token, '')).toBe(false);
  });

  it('answers false, not a throw, for strings of one length whose UTF-8 bytes differ in length', () => {
    // 'é' is one UTF-16 unit but two UTF-8 bytes (Unicode, UTF-8 encoding of U+00E9).
    const a = 'a'.repeat(43);
    const b = 'é' + 'a'.repeat(42);
    expect(a.length).toBe(b.length);
    expect(() => sameSecret(a, b)).not.toThrow();
    expect(sameSecret(a, b)).toBe(false);
  });

  it('compares through crypto.timingSafeEqual', () => {
    const spy = vi.spyOn(crypto, 'timingSafeEqual');
    sameSecret('first-secret-value', 'other-secret-value');
    expect(spy).toHaveBeenCalledTimes(1);
    spy.mockRestore();
  });
});
