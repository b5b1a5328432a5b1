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

/** Just enough of Express's request and response for the middleware: counts the answers built. */
function fakeExchange(stamp: string) {
  const req = { method: 'GET', dbStamp: stamp, session: { userId: 7 }, originalUrl: '/api/x', fresh: false };
  const headers = new Map<string, string>([['Content-Type', 'application/json; charset=utf-8']]);
  const sent: string[] = [];
  const res = {
    statusCode: 200,
    getHeader: (h: string) => headers.get(h),
    setHeader: (h: string, v: string) => headers.set(h, v),
    type: () => res,
    status: () => res,
    end: () => undefined,
    on: () => res,
    send: (body: unknown) => {
      sent.push(String(body));
      return res;
    },
  };
  return { req, res, sent };
}

describe('AnswerCache middleware', () => {
  it('lets one request build the next copy late in the window while the others are answered from the old one', async () => {
    let now = 0;
    const cache = new AnswerCache(1024, 1000, () => now);
    const mw = cache.middleware();
    let builds = 0;
    const run = (stamp = 's') => {
      const { req, res, sent } = fakeExchange(stamp);
      let built = false;
      // next(): the route itself, which builds and sends the answer.
      mw(req as never, res as never, () => {
        built = true;
        builds += 1;
        res.send(`{"n":${builds}}`);
      });
      return { sent, built: () => built };
    };
    run();
    expect(builds).toBe(1);
    now = 500; // computed: half the 1,000 ms window, well before renewal at 750 ms
    expect(run().sent).toEqual(['{"n":1}']);
    expect(builds).toBe(1);
    now = 800; // computed: past 750 ms (three quarters of 1,000): this request builds afresh
    const renewing = run();
    expect(renewing.built()).toBe(true);
    expect(renewing.sent).toEqual(['{"n":2}']);
    now = 900;
    expect(run().sent).toEqual(['{"n":2}']); // the new copy, built at 800, is used
    now = 1900; // computed: 1,100 ms after the copy built at 800: past the window, built again
    expect(run().built()).toBe(true);
    expect(builds).toBe(3);
    expect(run('t').built()).toBe(true); // another snapshot: never the old copy
    expect(builds).toBe(4);
  });

  it('answers from the old copy while the renewing request is still being built', () => {
    let now = 0;
    const cache = new AnswerCache(1024, 1000, () => now);
    const mw = cache.middleware();
    const first = fakeExchange('s');
    mw(first.req as never, first.res as never, () => first.res.send('{"v":"old"}'));
    now = 800; // computed: past the 750 ms renewal point
    const renewing = fakeExchange('s');
    let finishBuild: () => void = () => undefined;
    mw(renewing.req as never, renewing.res as never, () => {
      finishBuild = () => renewing.res.send('{"v":"new"}');
    });
    const meanwhile = fakeExchange('s');
    let builtMeanwhile = false;
    mw(meanwhile.req as never, meanwhile.res as never, () => (builtMeanwhile = true));
    expect(builtMeanwhile).toBe(false);
    expect(meanwhile.sent).toEqual(['{"v":"old"}']);
    finishBuild();
    const after = fakeExchange('s');
    mw(after.req as never, after.res as never, () => undefined);
    expect(after.sent).toEqual(['{"v":"new"}']);
  });
});
