import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import Papa from 'papaparse';
import { addCalendarDays, formatDate, localToday } from '@shared/dates';
import { weekStartOf } from '@shared/tasks/generate';
import { createDb } from '../../server/db/knex';
import { generateSiteTasks } from '../../server/services/tasks';
import { waterSummary } from '../../server/services/task-views';
import { runSummary } from '../../src/features/tasks/lib/runs';
import { taskWindowWords } from '../../src/features/tasks/lib/dates';
import { formatVolume } from '../../src/features/tasks/lib/units';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { SCREENSHOT_DIR } from '../helpers/browser';
import { mainNav, seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// The demo (seeds/02–06): Teodor holds A-1 (3 × 6 m, in the ground) at Mossgate Lane (metric, Europe/London);
// Orchard Corner is the club's US site. The demo's plantings and weather end in November 2026, so in the weeks
// these tests run A-1 has no watering task of its own: the situation is built below (see beforeAll).
const ZONE = 'Europe/London';
let clubId = 0;
let siteId = 0;
let usSiteId = 0;
let a1 = 0;
let a2 = 0;
let teodorId = 0;
let lettuceId = 0;
const today = () => localToday(ZONE);

/** Presses and lets go of an element with the mouse at its middle, as a finger or a pointer does. */
async function press(page: Page, target: Locator) {
  await target.scrollIntoViewIfNeeded();
  const box = (await target.boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.up();
}

const pageWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

/** Every visible button, link, select and input of the page's main part that is smaller than 44 px tall (text links inside sentences aside). */
const smallTargets = (page: Page) =>
  page.evaluate(() =>
    [...document.querySelectorAll('main button, main a[href], main select, main input:not([type=checkbox])')]
      .filter((el) => {
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0) return false;
        // Links within a line of text are exempt from the target size (WCAG 2.5.8, inline exception).
        if (el.tagName === 'A' && getComputedStyle(el).display === 'inline') return false;
        return r.height < 44;
      })
      .map((el) => `${el.tagName} ${(el.textContent ?? '').trim().slice(0, 40) || el.getAttribute('aria-label')}`),
  );

/** The open water task this week of the test's lettuce on A-1, if any. */
const lettuceWaterTask = () =>
  db('tasks as t')
    .join('plantings as pl', 'pl.id', 't.planting_id')
    .where({ 'pl.plot_id': a1, 'pl.crop_id': lettuceId, 't.kind': 'water', 't.gen_key': `water:${weekStartOf(today())}` })
    .first('t.id', 't.title', 't.amount_mm', 't.amount_l', 't.status', 't.window_from', 't.window_to');

beforeAll(async () => {
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  clubId = club.id;
  siteId = (await db('sites').where({ club_id: clubId, name: 'Mossgate Lane' }).first('id')).id;
  usSiteId = (await db('sites').where({ club_id: clubId, name: 'Orchard Corner' }).first('id')).id;
  a1 = (await db('plots').where({ site_id: siteId, label: 'A-1' }).first('id')).id;
  a2 = (await db('plots').where({ site_id: siteId, label: 'A-2' }).first('id')).id;
  teodorId = (await db('users').where({ email: 'teodor@example.org' }).first('id')).id;
  lettuceId = (await db('crops').whereNull('club_id').where({ slug: 'lettuce' }).first('id')).id;

  // A server's first start plans the day's tasks in the background (server/jobs): let that finish first, so the
  // runs below are the tests' own. Up to 30 s; the tests do not depend on it having happened.
  for (let i = 0; i < 60; i++) {
    const busy = await db('task_runs').whereIn('status', ['queued', 'running']).first('id');
    const any = await db('task_runs').first('id');
    if (any && !busy) break;
    await new Promise((r) => setTimeout(r, 500));
  }

  // Built for the test: lettuce transplanted on A-1 two weeks ago, so it is in the ground all this week. With no
  // weather logged in the week before today, its need is the rule of thumb (about 25 mm a week, shared/water), so
  // there is a watering task this week; the generator writes it as the nightly run would.
  const season = await db('seasons').where({ club_id: clubId, year: Number(today().slice(0, 4)) }).first('id');
  await db('plantings').insert({ plot_id: a1, season_id: season.id, crop_id: lettuceId, method: 'transplanted', planted_on: addCalendarDays(today(), -14), status: 'up' });
  await generateSiteTasks(db, siteId);
});

describe('tasks and water', () => {
  it('a holder on a phone logs rain from the gauge and sees his watering task shrink in the plot book', async () => {
    const before = await lettuceWaterTask();
    expect(before, 'the built lettuce has a watering task this week').toBeTruthy();
    expect(before.status).toBe('open');
    const beforeMm = Number(before.amount_mm);
    // The rain logged below must leave some water to give: the task shrinks rather than goes.
    expect(beforeMm).toBeGreaterThan(15);

    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await w.page.getByRole('link', { name: 'See the tasks' }).click();
    await w.page.getByRole('heading', { name: 'Plot book: A-1' }).waitFor();
    const tasks = w.page.getByRole('region', { name: 'Tasks', exact: true });
    // Next week's watering may read the same; this week's is the one with this week's window.
    const thisWeek = `Window: ${taskWindowWords(before.window_from, before.window_to, today())}`;
    const dry = tasks.getByRole('article', { name: before.title, exact: true }).filter({ hasText: thisWeek });
    await dry.waitFor();
    await dry.scrollIntoViewIfNeeded();
    await w.shot('tasks-plot-book-before-rain-phone');

    // Log 10 mm for today from the gauge, as the home page offers it.
    await (await mainNav(w.page)).getByRole('link', { name: 'Home' }).click();
    await w.page.getByRole('link', { name: 'Log the rain', exact: true }).click();
    await w.page.getByRole('heading', { name: 'Rain gauge', level: 1 }).waitFor();
    expect(await w.page.getByLabel('Day').inputValue()).toBe(today());
    await w.page.getByLabel('Rain (mm)').fill('10');
    await press(w.page, w.page.getByRole('button', { name: 'Save' }));
    const shortToday = formatDate(today(), 'UTC').replace(/ \d{4}$/, '');
    await w.page.getByText(`10 mm on ${shortToday} saved`).waitFor();

    // The saved rows: the day's rain from the gauge by Teodor, and the task re-planned in the same write.
    const day = await db('weather_days').where({ site_id: siteId, day: today() }).first('rain_mm', 'source', 'entered_by_user_id');
    expect(day).toEqual({ rain_mm: 10, source: 'gauge', entered_by_user_id: teodorId });
    const after = await lettuceWaterTask();
    expect(after.id).toBe(before.id);
    expect(after.status).toBe('open');
    // computed: the deficit is need − rain; the need stays the rule of thumb's, so the task is 10 mm less.
    expect(Number(after.amount_mm)).toBeCloseTo(beforeMm - 10, 1);
    // computed: 1 mm over 1 m² is 1 L, so 10 mm less over the plot's 18 m² is 180 L less (to the litre as stored).
    expect(Number(after.amount_l)).toBeCloseTo(Number(before.amount_l) - 180, 0);
    expect(after.title).not.toBe(before.title);

    // Back in the plot book through the app (no reload): the task as re-planned, the old amount gone.
    await (await mainNav(w.page)).getByRole('link', { name: 'Home' }).click();
    await w.page.getByRole('link', { name: 'See the tasks' }).click();
    const shrunk = tasks.getByRole('article', { name: after.title, exact: true }).filter({ hasText: thisWeek });
    await shrunk.waitFor();
    expect(await dry.count()).toBe(0);
    await shrunk.getByText(/rain logged 10 mm/).waitFor();
    await shrunk.scrollIntoViewIfNeeded();
    expect(await pageWidth(w.page)).toBeLessThanOrEqual(390);
    await w.shot('tasks-plot-book-after-rain-phone');
    // The task itself, as the phone shows it (the full-page shot is long).
    await shrunk.screenshot({ path: path.join(SCREENSHOT_DIR, 'tasks-plot-book-task-after-rain-phone.png') });
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 120_000);

  it('a coordinator filters the site’s tasks, downloads them, adds a repeating task, deletes one and makes the tasks now', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await (await mainNav(w.page)).getByRole('link', { name: 'Tasks', exact: true }).click();
    // Two sites: a choice of site first.
    await w.page.getByRole('heading', { name: 'Tasks', level: 1 }).waitFor();
    await w.shot('tasks-site-picker-desktop');
    await w.page.getByRole('link', { name: 'Tasks at Mossgate Lane' }).click();
    await w.page.getByRole('heading', { name: 'Tasks at Mossgate Lane', level: 1 }).waitFor();
    const table = w.page.getByRole('table', { name: 'Tasks at Mossgate Lane' });
    await table.waitFor();

    // Filter to watering: the URL keeps it, and the rows are the site's watering tasks in the default window
    // (four weeks back to eight ahead, server/services/task-views.ts).
    await w.page.getByLabel('Kind').selectOption({ label: 'Watering' });
    await expect.poll(() => new URL(w.page.url()).searchParams.get('kind')).toBe('water');
    const expected = await db('tasks')
      .where({ site_id: siteId, kind: 'water' })
      .where('window_to', '>=', addCalendarDays(today(), -28))
      .where('due_on', '<=', addCalendarDays(today(), 56))
      .select('title');
    expect(expected.length).toBeGreaterThan(0);
    const dataRows = table.getByRole('row').filter({ has: w.page.getByRole('cell') });
    await expect.poll(() => dataRows.count()).toBe(expected.length);
    for (const text of await dataRows.allInnerTexts()) expect(text).toContain('Watering');
    await dataRows.filter({ hasText: 'Water the lettuce' }).first().waitFor();

    // The CSV is the server's, with the same filter.
    const [download] = await Promise.all([w.page.waitForEvent('download'), w.page.getByRole('link', { name: 'Download CSV' }).click()]);
    expect(download.url()).toContain(`/api/sites/${siteId}/tasks.csv?kind=water`);
    const csv = Buffer.concat(await (await download.createReadStream()).toArray()).toString('utf8');
    const parsed = Papa.parse<Record<string, string>>(csv.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.data).toHaveLength(expected.length);
    expect(parsed.data.every((r) => r.Kind === 'Water')).toBe(true);
    expect(parsed.data.map((r) => r.Task).sort()).toEqual(expected.map((r) => r.title).sort());
    await w.shot('tasks-site-filtered-desktop');

    // Add a repeating site task. A repeat with no gap says so on the box; one that repeats too often is refused
    // by the server (400), and its words land on the Until box.
    await w.page.getByRole('button', { name: 'Add a task' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Add a task' });
    await dialog.getByLabel('Kind').selectOption({ label: 'Weeding' });
    await dialog.getByLabel('Title').fill('Hoe the main path');
    await dialog.getByLabel('Days to do it in').fill('3');
    await dialog.getByLabel('Repeat it').check();
    await dialog.getByLabel('Every how many days').fill('');
    await dialog.getByLabel('Until', { exact: true }).fill(addCalendarDays(today(), 21));
    await dialog.getByRole('button', { name: 'Add the task' }).click();
    await dialog.getByText('Say how many days apart').waitFor();
    await dialog.getByLabel('Every how many days').fill('1');
    await dialog.getByLabel('Until', { exact: true }).fill(addCalendarDays(today(), 300));
    await dialog.getByRole('button', { name: 'Add the task' }).click();
    // The server's words (server/services/task-views.ts): 301 dates is more than 200.
    await dialog.getByText('At most 200 repeats: choose an earlier end or a longer gap').waitFor();
    expect(await db('tasks').where({ site_id: siteId, title: 'Hoe the main path' }).first('id')).toBeUndefined();
    await dialog.getByLabel('Every how many days').fill('7');
    await dialog.getByLabel('Until', { exact: true }).fill(addCalendarDays(today(), 21));
    await w.shot('tasks-add-dialog-desktop');
    await dialog.getByRole('button', { name: 'Add the task' }).click();
    // computed: today, +7, +14 and +21 days
    await w.page.getByText('Added 4 tasks.').waitFor();
    const added = await db('tasks').where({ site_id: siteId, title: 'Hoe the main path' }).orderBy('due_on').select('id', 'due_on', 'window_to', 'plot_id', 'origin', 'kind');
    expect(added.map((t) => t.due_on)).toEqual([0, 7, 14, 21].map((d) => addCalendarDays(today(), d)));
    // computed: a 3-day window ends 2 days after its due date
    expect(added.map((t) => t.window_to)).toEqual([2, 9, 16, 23].map((d) => addCalendarDays(today(), d)));
    expect(added.every((t) => t.plot_id === null && t.origin === 'coordinator' && t.kind === 'weed')).toBe(true);

    // Clear the filter: the new tasks are in the table, for the coordinators, on the whole site.
    await w.page.getByRole('button', { name: 'Clear filters' }).click();
    await expect.poll(() => new URL(w.page.url()).search).toBe('');
    // All of them on one page, so none is on a later one.
    await w.page.getByLabel('Rows per page').selectOption('100');
    const hoeRows = dataRows.filter({ hasText: 'Hoe the main path' });
    await expect.poll(() => hoeRows.count()).toBe(4);
    expect(await hoeRows.first().innerText()).toMatch(/Whole site[\s\S]*Coordinators/);

    // Delete the last one after a confirm; "Keep it" keeps it.
    const last = hoeRows.filter({ hasText: formatDate(addCalendarDays(today(), 21), 'UTC').replace(/ \d{4}$/, '') }).first();
    await last.getByRole('button', { name: /^Delete/ }).click();
    const confirm = w.page.getByRole('dialog', { name: 'Delete “Hoe the main path”?' });
    await confirm.getByRole('button', { name: 'Keep it' }).click();
    expect(await db('tasks').where({ id: added[3].id }).first('id')).toBeTruthy();
    await last.getByRole('button', { name: /^Delete/ }).click();
    await confirm.getByRole('button', { name: 'Yes, delete the task' }).click();
    await w.page.getByText(/^Deleted “Hoe the main path”/).waitFor();
    expect(await db('tasks').where({ id: added[3].id }).first('id')).toBeUndefined();
    await expect.poll(() => hoeRows.count()).toBe(3);

    // Make tasks now, with a real pointer: radish sown on A-2 straight into the database (no re-plan yet), so the
    // run has tasks to add; the bar follows the run to 100 and the page says what it changed.
    const season = await db('seasons').where({ club_id: clubId, year: Number(today().slice(0, 4)) }).first('id');
    const radishId = (await db('crops').whereNull('club_id').where({ slug: 'radish' }).first('id')).id;
    await db('plantings').insert({ plot_id: a2, season_id: season.id, crop_id: radishId, method: 'sown', planted_on: addCalendarDays(today(), -3), status: 'sown' });
    const button = w.page.getByRole('button', { name: 'Make tasks now' });
    const started = w.page.waitForResponse((r) => r.url().endsWith(`/api/sites/${siteId}/task-runs`) && r.request().method() === 'POST');
    await press(w.page, button);
    const response = await started;
    expect(response.status()).toBe(202);
    const runId = ((await response.json()) as { id: number }).id;
    const bar = w.page.getByRole('progressbar', { name: /Making tasks|Plantings read/ });
    await bar.waitFor();
    const seen: string[] = [];
    await expect
      .poll(
        async () => {
          const now = (await bar.getAttribute('aria-valuenow')) ?? '';
          seen.push(now);
          return now;
        },
        { timeout: 30_000 },
      )
      .toBe('100');
    expect(seen.every((v) => /^\d+$/.test(v) && Number(v) >= 0 && Number(v) <= 100)).toBe(true);
    const run = await db('task_runs').where({ id: runId }).first('status', 'created', 'updated', 'removed', 'total', 'done');
    expect(run.status).toBe('done');
    expect(run.done).toBe(run.total);
    expect(run.created).toBeGreaterThan(0);
    await w.page.getByRole('status').filter({ hasText: `${runSummary(run)}.` }).waitFor();
    expect(await bar.getAttribute('aria-valuetext')).toBe(`100%: ${run.total} of ${run.total} plantings`);
    // The table was read again: the radish's tasks are there.
    await expect.poll(() => dataRows.filter({ hasText: /radish/i }).count()).toBeGreaterThan(0);
    expect(await pageWidth(w.page)).toBeLessThanOrEqual(1280);
    await w.shot('tasks-site-desktop');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors.filter((e) => !/status of 400/.test(e))).toEqual([]);
    // The one 400 is the refused repeat above.
    expect(w.errors.filter((e) => /status of 400/.test(e))).toHaveLength(1);
  }, 120_000);

  it('the site tasks page fits a phone', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 390);
    await w.page.goto(`${suite.server.url}/clubs/${clubId}/sites/${siteId}/tasks?kind=water`);
    await w.page.getByRole('heading', { name: 'Tasks at Mossgate Lane', level: 1 }).waitFor();
    await w.page.getByRole('table', { name: 'Tasks at Mossgate Lane' }).getByText('Water the lettuce', { exact: false }).first().waitFor();
    expect(await pageWidth(w.page)).toBeLessThanOrEqual(390);
    expect(await smallTargets(w.page)).toEqual([]);
    await w.shot('tasks-site-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 90_000);

  it('the water page: a holder on a phone from his plot book, a coordinator at 1280 on both sites', async () => {
    const summary = await waterSummary(db, { siteId, weeks: 8 });
    const a1Row = summary.plots.find((p) => p.plotId === a1)!;
    expect(a1Row.crops).toContain('Lettuce');

    const phone = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await phone.page.getByRole('link', { name: 'See the tasks' }).click();
    await phone.page.getByRole('link', { name: 'Water need at Mossgate Lane' }).click();
    await phone.page.getByRole('heading', { name: 'Water at Mossgate Lane', level: 1 }).waitFor();
    const plots = phone.page.getByRole('table', { name: 'Water per plot at Mossgate Lane this week' });
    const row = plots.getByRole('row').filter({ hasText: 'A-1' });
    await row.getByText(formatVolume(a1Row.litres, 'metric'), { exact: true }).waitFor();
    const chart = phone.page.getByRole('img', { name: /^Water need and rain logged per week, 8 weeks from / });
    await chart.waitFor();
    const weeks = phone.page.getByRole('region', { name: 'The weeks as a table' });
    // computed: 8 weeks asked for (src/features/tasks/api/get-water.ts), plus the header row
    expect(await weeks.getByRole('row').count()).toBe(9);
    await phone.page.getByText('ET0 worked out by:').waitFor();
    expect(await pageWidth(phone.page)).toBeLessThanOrEqual(390);
    expect(await smallTargets(phone.page)).toEqual([]);
    await phone.shot('water-phone');
    expect({ violations: await axeViolations(phone.page) }).toEqual({ violations: [] });
    expect(phone.errors).toEqual([]);

    const desk = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await (await mainNav(desk.page)).getByRole('link', { name: 'Sites' }).click();
    await desk.page.getByRole('link', { name: 'Water at Mossgate Lane' }).click();
    await desk.page.getByRole('heading', { name: 'Water at Mossgate Lane', level: 1 }).waitFor();
    await desk.page.getByRole('table', { name: 'Water per plot at Mossgate Lane this week' }).getByRole('row').filter({ hasText: 'A-1' }).waitFor();
    await desk.page.getByRole('img', { name: /^Water need and rain logged per week/ }).waitFor();
    await desk.shot('water-desktop');
    expect({ violations: await axeViolations(desk.page) }).toEqual({ violations: [] });

    // The US site: depths in inches and water in US gallons; nothing planted there this week.
    await desk.page.goto(`${suite.server.url}/clubs/${clubId}/sites/${usSiteId}/water`);
    await desk.page.getByRole('heading', { name: 'Water at Orchard Corner', level: 1 }).waitFor();
    await desk.page.getByRole('heading', { name: 'Nothing in the ground this week' }).waitFor();
    const usWeeks = desk.page.getByRole('region', { name: 'The weeks as a table' });
    expect(await usWeeks.getByRole('row').nth(1).innerText()).toMatch(/ in\b[\s\S]* US gallons/);
    await desk.page.getByText('about 1 inch of water a week', { exact: false }).waitFor();
    await desk.shot('water-us-desktop');
    expect({ violations: await axeViolations(desk.page) }).toEqual({ violations: [] });
    expect(desk.errors).toEqual([]);
  }, 120_000);
});
