import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { seededServerAndBrowser, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

async function openMap(width: number) {
  const w = await signInAsCoordinator(suite.browser, suite.server.url, width);
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  await w.page.goto(`${suite.server.url}/clubs/${club.id}/map`);
  await w.page.getByRole('heading', { name: 'Map of Mossgate Lane' }).waitFor();
  return w;
}

const plotRow = (label: string) =>
  db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.name': 'Mossgate Lane', 'p.label': label }).first('p.*');

function plot(page: Page, label: string) {
  // The name starts with what the plot shows: its label, then (with a season open) who holds it.
  return page.getByRole('button', { name: new RegExp(`^Plot ${label}( |$)`) });
}

/** Presses the middle of the box and drags it by (dx, dy) in two legs of `steps` moves each, then lets go. */
async function dragFromCentre(page: Page, box: { x: number; y: number; width: number; height: number }, dx: number, dy: number, steps: number) {
  const x = box.x + box.width / 2;
  const y = box.y + box.height / 2;
  await page.mouse.move(x, y);
  await page.mouse.down();
  await page.mouse.move(x + dx / 2, y + dy / 2, { steps });
  await page.mouse.move(x + dx, y + dy, { steps });
  await page.mouse.up();
}

async function savedAfter(page: Page, action: () => Promise<void>) {
  const saved = page.waitForResponse((r) => r.url().includes('/api/plots/') && r.request().method() === 'PATCH');
  await action();
  const res = await saved;
  expect(res.status(), await res.text()).toBe(200);
}

describe('the map editor', () => {
  it('moves a plot with a real pointer drag, snapped to the grid, and the move survives a reload', async () => {
    const w = await openMap(1280);
    await w.shot('map-desktop');
    const before = await plotRow('A-1');
    const box = (await plot(w.page, 'A-1').boundingBox())!;
    await savedAfter(w.page, () => dragFromCentre(w.page, box, -12, -10, 4));
    const after = await plotRow('A-1');
    expect(after.x_m).toBeLessThan(before.x_m);
    expect(after.y_m).toBeLessThan(before.y_m);
    // Snapped to the site's 0.1 m grid.
    expect(Math.abs(after.x_m * 10 - Math.round(after.x_m * 10))).toBeLessThan(1e-6);
    expect(after.version).toBe(before.version + 1);

    await w.page.reload();
    await plot(w.page, 'A-1').waitFor();
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    const moved = (await plot(w.page, 'A-1').boundingBox())!;
    const scale = map.width / 34; // the site is 34 m wide
    expect(Math.abs(moved.x - map.x - after.x_m * scale)).toBeLessThan(1.5);
    expect(Math.abs(moved.y - map.y - after.y_m * scale)).toBeLessThan(1.5);
    expect(w.errors).toEqual([]);
  });

  it('resizes the selected plot by dragging its grip', async () => {
    const w = await openMap(1280);
    const before = await plotRow('A-5');
    await plot(w.page, 'A-5').click();
    const grip = (await w.page.getByRole('button', { name: 'Resize plot A-5' }).boundingBox())!;
    await savedAfter(w.page, () => dragFromCentre(w.page, grip, -10, -20, 3));
    const after = await plotRow('A-5');
    expect(after.width_m).toBeLessThan(before.width_m);
    expect(after.length_m).toBeLessThan(before.length_m);
    expect([after.x_m, after.y_m]).toEqual([before.x_m, before.y_m]);
    const history = await db('plot_events').where({ plot_id: after.id }).orderBy('id', 'desc').first();
    expect(history.kind).toBe('resized');
    expect(w.errors).toEqual([]);
  });

  it('grows a plot when its grip is dragged down and to the right, and saves the size that was shown', async () => {
    const w = await openMap(1280);
    const before = await plotRow('A-6');
    await plot(w.page, 'A-6').click();
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    const scale = map.width / 34; // the site is 34 m wide
    const grip = (await w.page.getByRole('button', { name: 'Resize plot A-6' }).boundingBox())!;
    const x = grip.x + grip.width / 2;
    const y = grip.y + grip.height / 2;
    await w.page.mouse.move(x, y);
    await w.page.mouse.down();
    // Small real pointer moves, as a hand makes them: 0.5 m east and 0.5 m south in all (the path to B-6 is 0.9 m).
    for (let i = 1; i <= 20; i++) await w.page.mouse.move(x + (0.5 * scale * i) / 20, y + (0.5 * scale * i) / 20);
    const shown = (await plot(w.page, 'A-6').boundingBox())!;
    await savedAfter(w.page, () => w.page.mouse.up());
    const after = await plotRow('A-6');
    // Computed: 0.5 m and 0.5 m of pointer travel, snapped to the 0.1 m grid.
    const [east, south] = after.rotation === 90 ? [after.length_m, after.width_m] : [after.width_m, after.length_m];
    const [eastBefore, southBefore] = before.rotation === 90 ? [before.length_m, before.width_m] : [before.width_m, before.length_m];
    expect(east).toBeCloseTo(eastBefore + 0.5, 6);
    expect(south).toBeCloseTo(southBefore + 0.5, 6);
    expect([after.x_m, after.y_m]).toEqual([before.x_m, before.y_m]);
    // What was on screen as the pointer let go is what was saved.
    expect(Math.abs(shown.width - east * scale)).toBeLessThan(2);
    expect(Math.abs(shown.height - south * scale)).toBeLessThan(2);
    expect(w.errors).toEqual([]);
  });

  it('does not scroll the page while a grip is dragged near the bottom of the window', async () => {
    const w = await openMap(1280);
    const before = await plotRow('B-7');
    await plot(w.page, 'B-7').click();
    const gripButton = w.page.getByRole('button', { name: 'Resize plot B-7' });
    // Bring the grip to about 20 px above the bottom edge of the window.
    const viewport = w.page.viewportSize()!;
    const at = (await gripButton.boundingBox())!;
    await w.page.evaluate((by) => window.scrollBy(0, by), at.y - (viewport.height - 20));
    const scrolled = await w.page.evaluate(() => window.scrollY);
    const grip = (await gripButton.boundingBox())!;
    const x = grip.x + grip.width / 2;
    const y = grip.y + grip.height / 2;
    await w.page.mouse.move(x, y);
    await w.page.mouse.down();
    for (let i = 1; i <= 15; i++) await w.page.mouse.move(x + i, Math.min(viewport.height - 2, y + i));
    // Hold still near the edge, where an auto-scroll would keep going.
    await w.page.waitForTimeout(600);
    const shown = (await plot(w.page, 'B-7').boundingBox())!;
    expect(await w.page.evaluate(() => window.scrollY)).toBe(scrolled);
    await w.page.mouse.up();
    await expect.poll(async () => (await plotRow('B-7')).version, { timeout: 10_000 }).toBeGreaterThan(before.version);
    const after = await plotRow('B-7');
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    const scale = map.width / 34;
    const [east, south] = after.rotation === 90 ? [after.length_m, after.width_m] : [after.width_m, after.length_m];
    expect(Math.abs(shown.width - east * scale)).toBeLessThan(2);
    expect(Math.abs(shown.height - south * scale)).toBeLessThan(2);
    expect(after.y_m + south).toBeLessThanOrEqual(22 + 1e-6); // still on the 22 m long site
    expect(w.errors).toEqual([]);
  });

  it('follows the pointer when a resize runs into a neighbour, then puts the plot back and saves nothing', async () => {
    const w = await openMap(1280);
    const before = await plotRow('B-7');
    await plot(w.page, 'B-7').click();
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    const scale = map.width / 34;
    const grip = (await w.page.getByRole('button', { name: 'Resize plot B-7' }).boundingBox())!;
    const plotBefore = (await plot(w.page, 'B-7').boundingBox())!;
    const x = grip.x + grip.width / 2;
    const y = grip.y + grip.height / 2;
    const patches: number[] = [];
    w.page.on('request', (r) => {
      if (r.url().includes('/api/plots/') && r.method() === 'PATCH') patches.push(1);
    });
    await w.page.mouse.move(x, y);
    await w.page.mouse.down();
    // 1.2 m east and south in small moves: east of B-7 the path to B-8 is only 0.9 m wide.
    for (let i = 1; i <= 12; i++) await w.page.mouse.move(x + (1.2 * scale * i) / 12, y + (1.2 * scale * i) / 12);
    await w.page.getByText('Here it would overlap another plot').waitFor();
    const shown = (await plot(w.page, 'B-7').boundingBox())!;
    // The drawing follows the pointer (computed: 1.2 m more each way, snapped to 0.1 m), not a runaway.
    expect(Math.abs(shown.width - plotBefore.width - 1.2 * scale)).toBeLessThan(0.15 * scale);
    expect(Math.abs(shown.height - plotBefore.height - 1.2 * scale)).toBeLessThan(0.15 * scale);
    await w.page.mouse.up();
    await w.page.getByText(/^Plot B-7 was put back: there it would overlap plot B-8/).first().waitFor();
    expect(patches).toEqual([]);
    const after = await plotRow('B-7');
    expect([after.width_m, after.length_m, after.version]).toEqual([before.width_m, before.length_m, before.version]);
    expect(w.errors).toEqual([]);
  });

  it('moves a plot with the keyboard only, one grid step per arrow press', async () => {
    const w = await openMap(1280);
    const before = await plotRow('B-3');
    await plot(w.page, 'B-3').focus();
    await savedAfter(w.page, async () => {
      await w.page.keyboard.press('Space');
      await w.page.keyboard.press('ArrowDown');
      await w.page.keyboard.press('ArrowDown');
      await w.page.keyboard.press('ArrowRight');
      await w.page.keyboard.press('Space');
    });
    const after = await plotRow('B-3');
    expect(after.y_m).toBeCloseTo(before.y_m + 0.2, 6);
    expect(after.x_m).toBeCloseTo(before.x_m + 0.1, 6);

    // Shift + arrow makes it one grid step wider; two quick presses are two saved steps, not a
    // conflict with itself.
    await plot(w.page, 'B-3').focus();
    const answers: number[] = [];
    w.page.on('response', (r) => {
      if (r.url().includes('/api/plots/') && r.request().method() === 'PATCH') answers.push(r.status());
    });
    await w.page.keyboard.press('Shift+ArrowRight');
    await w.page.keyboard.press('Shift+ArrowRight');
    await expect.poll(() => answers.length, { timeout: 10_000 }).toBe(2);
    expect(answers).toEqual([200, 200]);
    expect((await plotRow('B-3')).width_m).toBeCloseTo(before.width_m + 0.2, 6);
    expect(w.errors).toEqual([]);
  });

  it('refuses a move onto another plot with a clear message and puts the plot back', async () => {
    const w = await openMap(1280);
    const before = await plotRow('A-7');
    await plot(w.page, 'A-7').click();
    await w.page.getByLabel('From west edge (m)').fill(String(before.x_m + 2));
    const refused = w.page.waitForResponse((r) => r.url().includes('/api/plots/') && r.request().method() === 'PATCH');
    await w.page.getByRole('button', { name: 'Save plot' }).click();
    expect((await refused).status()).toBe(409);
    await w.page.getByText('That would overlap plot A-8. Plots may touch but not overlap.').first().waitFor();
    expect((await plotRow('A-7')).x_m).toBe(before.x_m);
    await w.shot('map-overlap-refused');
    expect(w.errors.filter((e) => !e.includes('409'))).toEqual([]);
  });

  it('shows the whole site on a phone, with neighbours of the selected plot', async () => {
    const w = await openMap(390);
    await plot(w.page, 'B-4').click();
    await w.page.getByRole('heading', { name: 'Plot B-4' }).waitFor();
    await w.page.getByText('to the north, across 0.9 m of path').waitFor();
    await w.shot('map-phone');
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    expect(map.width).toBeLessThanOrEqual(390);
    expect(w.errors).toEqual([]);
  });
});
