import { describe, expect, it } from 'vitest';
import { AnswerCache } from './answer-cache';

const answer = (stamp: string, at: number, text = '{}') => ({ stamp, at, body: Buffer.from(text) });

describe('AnswerCache', () => {
  it('reuses an answer only under the same stamp and within the clock window', () => {
    let now = 10_000;
    const cache = new AnswerCache(1024, 1000, () => now);
    cache.set('1 /api/x', answer('s1', now));
    expect(cache.get('1 /api/x', 's1')?.body.toString()).toBe('{}');
    expect(cache.get('1 /api/x', 's2')).toBeUndefined(); // another snapshot: dropped
    cache.set('1 /api/x', answer('s1', now));
    now += 1001; // computed: more than the 1,000 ms window after it was built
    expect(cache.get('1 /api/x', 's1')).toBeUndefined();
  });

  it('keeps to its byte bound, dropping the least recently used first', () => {
    const cache = new AnswerCache(10, 1000, () => 0);
    cache.set('a', answer('s', 0, '12345'));
    cache.set('b', answer('s', 0, '12345'));
    cache.get('a', 's');
    cache.set('c', answer('s', 0, '12345')); // computed: 15 bytes > 10, "b" was used least recently
    expect(cache.get('b', 's')).toBeUndefined();
    expect(cache.get('a', 's')).toBeDefined();
    expect(cache.get('c', 's')).toBeDefined();
    cache.set('huge', answer('s', 0, '12345678901'));
    expect(cache.get('huge', 's')).toBeUndefined(); // larger than the whole bound: never kept
  });
});
