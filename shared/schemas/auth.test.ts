import { describe, expect, it } from 'vitest';
import { roleWords } from './auth';

describe('roleWords', () => {
  it('names every role in lower-case words, in the usual order', () => {
    // Wording: lower case as inside a sentence ("join as plot holder, volunteer").
    expect(roleWords(['volunteer', 'plot_holder'])).toBe('plot holder, volunteer');
    expect(roleWords(['coordinator'])).toBe('coordinator');
    expect(roleWords([])).toBe('');
  });
});
