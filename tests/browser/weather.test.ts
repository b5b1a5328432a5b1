import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { formatDate, localToday } from '@shared/dates';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { DEMO_CLUB, seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// Teodor holds A-1 at Mossgate Lane (metric, Europe/London) in 2026 (seeds/03); the demo weather runs
// to 20 November 2026 (seeds/05), so today's day is empty at the start.
const ZONE = 'Europe/London';
let siteId = 0;
let teodorId = 0;
beforeAll(async () => {
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  siteId = (await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id')).id;
  teodorId = (await db('users').where({ email: 'teodor@example.org' }).first('id')).id;
});

/** Presses and lets go of a button with the mouse at its middle, as a finger or a pointer does. */
async function press(page: Page, button: Locator) {
  const box = (await button.boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.up();
}

const noSideScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

describe('the weather log', () => {
  it('a holder on a phone opens the rain gauge from home, taps the rain in with the buttons, saves it (and keeps it through a failure), and finds it in the log', async () => {
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await w.page.getByRole('heading', { name: DEMO_CLUB }).waitFor();
    await w.page.getByRole('link', { name: 'Log the rain', exact: true }).click();
    await w.page.getByRole('heading', { name: 'Rain gauge', level: 1 }).waitFor();
    const today = localToday(ZONE);
    const shortToday = formatDate(today, 'UTC').replace(/ \d{4}$/, '');
    // One site to log for, so no choice of site; the day starts at today in the site's zone.
    await w.page.getByText('Mossgate Lane', { exact: true }).waitFor();
    expect(await w.page.getByLabel('Site').count()).toBe(0);
    expect(await w.page.getByLabel('Day').inputValue()).toBe(today);
    await w.page.getByText(`Nothing is logged for ${shortToday} yet.`).waitFor();

    const more = w.page.getByRole('button', { name: 'More 1 mm' });
    const less = w.page.getByRole('button', { name: 'Less 1 mm' });
    const rain = w.page.getByLabel('Rain (mm)');
    for (let i = 0; i < 5; i++) await press(w.page, more);
    await press(w.page, less);
    // computed: five steps up and one down of 1 mm each
    await expect.poll(() => rain.inputValue()).toBe('4');
    expect(await noSideScroll(w.page)).toBeLessThanOrEqual(390);
    await w.shot('rain-gauge-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });

    await press(w.page, w.page.getByRole('button', { name: 'Save' }));
    await w.page.getByText(`4 mm on ${shortToday} saved`).waitFor();
    await w.page.getByText(new RegExp(`^Logged for ${shortToday}: 4 mm\\.`)).waitFor();
    const row = await db('weather_days').where({ site_id: siteId, day: today }).first();
    expect([row.rain_mm, row.source, row.entered_by_user_id, row.t_max_c]).toEqual([4, 'gauge', teodorId, null]);

    // The network fails on the next save: the message says so and the 5 mm typed stays.
    await press(w.page, more);
    await expect.poll(() => rain.inputValue()).toBe('5');
    await w.page.route('**/api/sites/*/weather/*', (route) =>
      route.request().method() === 'PUT'
        ? route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unavailable', message: 'The database is not reachable just now.' } }) })
        : route.continue(),
    );
    await press(w.page, w.page.getByRole('button', { name: 'Save' }));
    await w.page.getByRole('alert').filter({ hasText: 'The database is not reachable just now. What you typed is still here' }).waitFor();
    expect(await rain.inputValue()).toBe('5');
    expect(await w.page.getByLabel('Day').inputValue()).toBe(today);
    expect((await db('weather_days').where({ site_id: siteId, day: today }).first()).rain_mm).toBe(4);
    await w.page.unroute('**/api/sites/*/weather/*');
    await press(w.page, w.page.getByRole('button', { name: 'Save' }));
    await w.page.getByText(`5 mm on ${shortToday} saved`).waitFor();
    expect((await db('weather_days').where({ site_id: siteId, day: today }).first()).rain_mm).toBe(5);

    await w.page.getByRole('link', { name: 'The weather log for Mossgate Lane' }).click();
    await w.page.getByRole('heading', { name: 'Weather log', level: 1 }).waitFor();
    const days = w.page.getByRole('table', { name: 'Weather at Mossgate Lane' });
    const todayRow = days.getByRole('row').filter({ hasText: formatDate(today, 'UTC') });
    await todayRow.getByText('5 mm', { exact: true }).waitFor();
    await todayRow.getByText('Rain gauge').waitFor();
    // A holder may edit but not delete, and sees nobody's name.
    expect(await todayRow.getByRole('button', { name: /^Edit/ }).count()).toBe(1);
    expect(await days.getByRole('button', { name: /^Delete/ }).count()).toBe(0);
    expect(await days.getByText('Teodor Lind').count()).toBe(0);
    // The demo's last invented day is in the last eight weeks too.
    await days.getByRole('row').filter({ hasText: '20 Nov 2026' }).first().waitFor();
    expect(await noSideScroll(w.page)).toBeLessThanOrEqual(390);
    await w.shot('weather-log-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors.filter((e) => !/status of 503/.test(e))).toEqual([]);
    expect(w.errors.filter((e) => /status of 503/.test(e))).toHaveLength(1);
  }, 90_000);

  it('a coordinator finds who logged the rain, corrects a day in the dialog, deletes one after a confirm and imports a file with a preview', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await w.page.goto(`${suite.server.url}/clubs/${(await db('clubs').where({ slug: 'mossgate' }).first('id')).id}/sites`);
    await w.page.getByRole('link', { name: 'Weather at Mossgate Lane' }).click();
    await w.page.getByRole('heading', { name: 'Weather log', level: 1 }).waitFor();
    const days = w.page.getByRole('table', { name: 'Weather at Mossgate Lane' });
    const today = localToday(ZONE);
    await days.getByRole('row').filter({ hasText: formatDate(today, 'UTC') }).getByText('Teodor Lind').waitFor();

    // Correct 20 November: the dialog holds the day's values in °C, mm and m/s.
    const nov20 = days.getByRole('row').filter({ hasText: '20 Nov 2026' });
    await nov20.getByRole('button', { name: 'Edit 20 Nov 2026' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Weather on 20 Nov 2026' });
    const stored = await db('weather_days').where({ site_id: siteId, day: '2026-11-20' }).first();
    expect(await dialog.getByLabel('Highest temperature (°C)').inputValue()).toBe(String(stored.t_max_c));
    await dialog.getByLabel('Rain (mm)').fill('7.4');
    await dialog.getByLabel('Lowest temperature (°C)').fill(String(stored.t_max_c + 1));
    await dialog.getByRole('button', { name: 'Save the day' }).click();
    await dialog.getByText('The lowest temperature is above the highest').waitFor();
    await dialog.getByLabel('Lowest temperature (°C)').fill(String(stored.t_min_c));
    await dialog.getByRole('button', { name: 'Save the day' }).click();
    await w.page.getByText('Saved the weather for 20 Nov 2026.').waitFor();
    const corrected = await db('weather_days').where({ site_id: siteId, day: '2026-11-20' }).first();
    expect([corrected.rain_mm, corrected.t_min_c, corrected.t_max_c, corrected.wind_ms, corrected.source]).toEqual([7.4, stored.t_min_c, stored.t_max_c, stored.wind_ms, 'form']);

    // Delete 19 November, after saying yes.
    await days.getByRole('row').filter({ hasText: '19 Nov 2026' }).getByRole('button', { name: 'Delete 19 Nov 2026' }).click();
    const confirm = w.page.getByRole('dialog', { name: 'Delete the weather for 19 Nov 2026?' });
    await confirm.getByRole('button', { name: 'Keep it' }).click();
    expect(await db('weather_days').where({ site_id: siteId, day: '2026-11-19' }).first()).toBeTruthy();
    await days.getByRole('row').filter({ hasText: '19 Nov 2026' }).getByRole('button', { name: 'Delete 19 Nov 2026' }).click();
    await confirm.getByRole('button', { name: 'Yes, delete the day' }).click();
    await w.page.getByText('Deleted the weather for 19 Nov 2026.').waitFor();
    expect(await db('weather_days').where({ site_id: siteId, day: '2026-11-19' }).first()).toBeUndefined();

    // Import two days: 19 November comes back, 18 November is replaced by the file's row.
    const importer = w.page.getByRole('region', { name: 'Import days from a CSV file' });
    await importer.getByLabel('Replace it with the file’s row').check();
    await importer.getByLabel('Day rows').fill('date,t_min,t_max,rain\n2026-11-18,3,9,1.2\n2026-11-19,4,10,0\n');
    await importer.getByRole('button', { name: 'Check file' }).click();
    await importer.getByText('1 new day, 1 day replaced, 0 days skipped. Nothing is saved yet.').waitFor();
    await importer.getByRole('button', { name: 'Import 2 days' }).click();
    await importer.getByText('1 new day, 1 day replaced, 0 days skipped. The table above shows them.').waitFor();
    const imported = await db('weather_days').where({ site_id: siteId }).whereIn('day', ['2026-11-18', '2026-11-19']).orderBy('day').select('day', 't_min_c', 'rain_mm', 'sunshine_h', 'source');
    expect(imported).toEqual([
      { day: '2026-11-18', t_min_c: 3, rain_mm: 1.2, sunshine_h: null, source: 'import' },
      { day: '2026-11-19', t_min_c: 4, rain_mm: 0, sunshine_h: null, source: 'import' },
    ]);
    await w.shot('weather-log-desktop');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 90_000);
});
