import { describe, expect, it } from 'vitest';
import { isSealed, openText, sealText, useMailSealSecret } from './seal';

describe('outbox sealing', () => {
  it('opens what it sealed, and the sealed text holds none of the plain text', () => {
    useMailSealSecret('a-test-secret-that-is-at-least-32-characters');
    const plain = 'Accept: https://example.org/invite?token=Zm9vYmFyYmF6cXV4cXV1eHF1dXpxdXV6cXV1enF1dXo — café';
    const sealed = sealText(plain);
    expect(isSealed(sealed)).toBe(true);
    expect(sealed).not.toContain('Zm9vYmFyYmF6');
    expect(sealed).not.toContain('invite');
    expect(openText(sealed)).toBe(plain);
    // A fresh IV each time: the same text never seals the same way twice.
    expect(sealText(plain)).not.toBe(sealed);
  });

  it('refuses a changed value and a value sealed under another secret', () => {
    useMailSealSecret('a-test-secret-that-is-at-least-32-characters');
    const sealed = sealText('Your link: https://example.org/reset-password?token=abc');
    const last = sealed.at(-2) === 'A' ? 'B' : 'A';
    expect(() => openText(sealed.slice(0, -2) + last + sealed.at(-1))).toThrow();
    useMailSealSecret('another-secret-that-is-at-least-32-characters');
    expect(() => openText(sealed)).toThrow();
    expect(() => openText('plain text')).toThrow(/not sealed/);
    expect(isSealed('plain text')).toBe(false);
  });
});
