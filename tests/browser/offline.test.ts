import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { localToday } from '@shared/dates';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { DEMO_CLUB, seededServerAndBrowser, signInAs } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// Teodor holds A-1 at Mossgate Lane (metric, Europe/London) this season (seeds/03); the demo weather ends on
// 20 November 2026 (seeds/05), so today's day has no row at the start.
const ZONE = 'Europe/London';
// The brief: a phone's width.
const PHONE = 390;
let siteId = 0;
beforeAll(async () => {
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  siteId = (await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id')).id;
});

/** Waits until the service worker controls the page (it claims its clients once its shell is cached). */
async function controlled(page: Page) {
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null), { timeout: 30_000 }).toBe(true);
}

/** The entries the page keeps in IndexedDB (src/lib/offline/queue.ts), read from the page itself. */
const queued = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<{ key: string; body: unknown; path: string }[]>((resolve, reject) => {
        const open = indexedDB.open('tillwell-offline', 1);
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const all = open.result.transaction('entries').objectStore('entries').getAll();
          all.onsuccess = () => resolve(all.result as { key: string; body: unknown; path: string }[]);
        };
      }),
  );

const dayRows = async (day: string) => Number((await db('weather_days').where({ site_id: siteId, day }).count({ n: '*' }))[0].n);

describe('a weak signal at the plot', () => {
  it('opens the rain gauge with no connection once visited, keeps a reading made offline and sends it once when back online', async () => {
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', PHONE);
    const { page } = w;
    const context = page.context();
    await page.getByRole('heading', { name: DEMO_CLUB }).waitFor();
    await page.getByRole('link', { name: 'Log the rain', exact: true }).click();
    await page.getByRole('heading', { name: 'Rain gauge', level: 1 }).waitFor();
    await controlled(page);
    // Visited once under the worker, so its reads are kept.
    await page.reload();
    await page.getByRole('heading', { name: 'Rain gauge', level: 1 }).waitFor();
    const today = localToday(ZONE);
    await page.getByText(/^(Nothing is logged for|Logged for)/).waitFor();
    expect(await dayRows(today)).toBe(0);

    await context.setOffline(true);
    // The switch must stop the worker's own fetches too: a read the worker would pass to the network and has
    // never kept (no shift 999999) fails instead of answering 404.
    expect(await page.evaluate(() => fetch('/api/shifts/999999').then((r) => r.status, () => 'failed'))).toBe('failed');
    await page.reload();
    await page.getByRole('heading', { name: 'Rain gauge', level: 1 }).waitFor();
    await page.getByText('Mossgate Lane', { exact: true }).waitFor();

    for (let i = 0; i < 3; i++) await page.getByRole('button', { name: 'More 1 mm' }).click();
    await expect.poll(() => page.getByLabel('Rain (mm)').inputValue()).toBe('3');
    await page.getByRole('button', { name: 'Save' }).click();
    const kept = page.getByRole('region', { name: /^Kept on this phone/ });
    await kept.getByText('Waiting to send').waitFor();
    await kept.getByText(/^3 mm on /).waitFor();
    await w.shot('offline-rain-gauge-waiting');
    const [entry] = await queued(page);
    expect(entry.path).toBe(`/api/sites/${siteId}/weather/${today}`);
    expect(entry.key).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/); // RFC 9562 UUID version 4
    expect(await dayRows(today)).toBe(0);

    // Reloading while still offline keeps the entry (never lose what was typed).
    await page.reload();
    await page.getByRole('region', { name: /^Kept on this phone/ }).getByText('Waiting to send').waitFor();

    await context.setOffline(false);
    await kept.waitFor({ state: 'detached' });
    await expect.poll(() => dayRows(today)).toBe(1);
    expect(Number((await db('weather_days').where({ site_id: siteId, day: today }).first()).rain_mm)).toBe(3);
    expect(await queued(page)).toEqual([]);
    const xmin = (await db('weather_days').where({ site_id: siteId, day: today }).first(db.raw('xmin::text as x'))).x;

    // The same key sent again by hand: the stored answer, still one row, not written again.
    const csrf = ((await (await page.request.get(`${suite.server.url}/api/session`)).json()) as { csrfToken: string }).csrfToken;
    const replay = await page.request.put(`${suite.server.url}${entry.path}`, {
      headers: { 'X-CSRF-Token': csrf, 'Idempotency-Key': entry.key },
      data: entry.body,
    });
    expect(replay.status()).toBe(201);
    expect(replay.headers()['idempotent-replayed']).toBe('true');
    expect(await dayRows(today)).toBe(1);
    expect((await db('weather_days').where({ site_id: siteId, day: today }).first(db.raw('xmin::text as x'))).x).toBe(xmin);

    // Offline, the browser logs the failed loads; nothing else may be an error.
    expect(w.errors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to fetch|net::ERR_FAILED/.test(e))).toEqual([]);
    await context.close();
  }, 120_000);

  it('opens the plot book with no connection once visited, keeps a task marked done offline and sends it once', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const plot = await db('plots').where({ site_id: siteId, label: 'A-1' }).first('id');
    const today = localToday(ZONE);
    // A coordinator's task on A-1 whose window holds today, so it shows under this week with a Done button.
    const [task] = await db('tasks')
      .insert({ club_id: club.id, site_id: siteId, plot_id: plot.id, origin: 'coordinator', kind: 'weed', title: 'Weed the offline test bed', due_on: today, window_from: today, window_to: today })
      .returning(['id', 'version']);

    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', PHONE);
    const { page } = w;
    const context = page.context();
    await page.getByRole('heading', { name: DEMO_CLUB }).waitFor();
    await page.goto(`${suite.server.url}/clubs/${club.id}/plots/${plot.id}/book`);
    await page.getByRole('heading', { name: 'Plot book: A-1' }).waitFor();
    await controlled(page);
    await page.reload();
    const done = page.getByRole('button', { name: 'Done: Weed the offline test bed' });
    await done.waitFor();

    await context.setOffline(true);
    await page.reload();
    await page.getByRole('heading', { name: 'Plot book: A-1' }).waitFor();
    await done.click();
    const kept = page.getByRole('region', { name: /^Kept on this phone/ });
    await kept.getByText('Waiting to send').waitFor();
    await kept.getByText('Done: Weed the offline test bed').waitFor();
    await w.shot('offline-task-done-waiting');
    const [entry] = await queued(page);
    expect(entry.path).toBe(`/api/tasks/${task.id}/done`);
    expect((await db('tasks').where({ id: task.id }).first()).status).toBe('open');

    await context.setOffline(false);
    await kept.waitFor({ state: 'detached' });
    await expect.poll(async () => (await db('tasks').where({ id: task.id }).first()).status).toBe('done');
    // One write: the version moved by exactly one. computed: created at 1, done once = 2.
    expect((await db('tasks').where({ id: task.id }).first()).version).toBe(task.version + 1);

    const csrf = ((await (await page.request.get(`${suite.server.url}/api/session`)).json()) as { csrfToken: string }).csrfToken;
    const replay = await page.request.post(`${suite.server.url}${entry.path}`, {
      headers: { 'X-CSRF-Token': csrf, 'Idempotency-Key': entry.key },
      data: entry.body,
    });
    // The stored answer (200), not the 409 a second Done with the old version would get.
    expect(replay.status()).toBe(200);
    expect(replay.headers()['idempotent-replayed']).toBe('true');
    expect((await db('tasks').where({ id: task.id }).first()).version).toBe(task.version + 1);
    expect(await db('idempotency_keys').where({ key: entry.key }).count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(w.errors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to fetch|net::ERR_FAILED/.test(e))).toEqual([]);
    await context.close();
  }, 120_000);
});
