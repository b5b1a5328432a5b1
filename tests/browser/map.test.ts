import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { clippedSelects, unreadablePlots } from '../helpers/clipping';
import { openMenuIfClosed, seededServerAndBrowser, signInAsCoordinator } from '../helpers/session';

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

/** The map's top edge in page coordinates (independent of scrolling). */
const mapTop = (page: Page) =>
  page.getByRole('group', { name: 'Map of Mossgate Lane' }).evaluate((el) => el.getBoundingClientRect().top + window.scrollY);

/** What dnd-kit's live region says to a screen reader now. */
const liveRegion = (page: Page) => page.locator('[id^="DndLiveRegion"]').textContent().then((t) => (t ?? '').trim());

/** Collects the status of each plot PATCH answer on the page from now on. */
function patchAnswers(page: Page): number[] {
  const answers: number[] = [];
  page.on('response', (r) => {
    if (r.url().includes('/api/plots/') && r.request().method() === 'PATCH') answers.push(r.status());
  });
  return answers;
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
  it('shows the put-back notice without moving the map under the pointer', async () => {
    const w = await openMap(1280);
    await plot(w.page, 'B-5').click();
    const top = await mapTop(w.page);
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    const scale = map.width / 34; // the site is 34 m wide
    const grip = (await w.page.getByRole('button', { name: 'Resize plot B-5' }).boundingBox())!;
    const x = grip.x + grip.width / 2;
    const y = grip.y + grip.height / 2;
    await w.page.mouse.move(x, y);
    await w.page.mouse.down();
    // 1.2 m east in small moves: the path between B-5 and B-6 is 0.9 m wide (seeds), so it runs into B-6.
    for (let i = 1; i <= 12; i++) await w.page.mouse.move(x + (1.2 * scale * i) / 12, y);
    await w.page.getByText('Here it would overlap another plot').waitFor();
    expect(await mapTop(w.page)).toBe(top);
    await w.page.mouse.up();
    await w.page.getByText(/^Plot B-5 was put back: there it would overlap plot B-6/).first().waitFor();
    expect(await mapTop(w.page)).toBe(top);
    await w.shot('map-notice-1280');
    expect(w.errors).toEqual([]);
  });

  it('tells a screen reader about a pointer drag in plot labels and metres, never internal ids', async () => {
    const w = await openMap(1280);
    const box = (await plot(w.page, 'A-2').boundingBox())!;
    const x = box.x + box.width / 2;
    const y = box.y + box.height / 2;
    await w.page.mouse.move(x, y);
    await w.page.mouse.down();
    await w.page.mouse.move(x, y + 6, { steps: 3 });
    await expect.poll(() => liveRegion(w.page), { timeout: 5_000 }).toMatch(/A-2/);
    expect(await liveRegion(w.page)).toBe('Plot A-2 picked up.');
    await savedAfter(w.page, async () => {
      await w.page.mouse.move(x, y + 12, { steps: 3 });
      await w.page.mouse.up();
    });
    const moved = await plotRow('A-2');
    // The words come from the saved place, in the site's metres.
    await expect.poll(() => liveRegion(w.page), { timeout: 5_000 }).toBe(
      `Plot A-2 moved to ${moved.x_m.toFixed(1)} m from the west edge, ${moved.y_m.toFixed(1)} m from the north edge.`,
    );

    await plot(w.page, 'A-4').click();
    const grip = (await w.page.getByRole('button', { name: 'Resize plot A-4' }).boundingBox())!;
    await savedAfter(w.page, () => dragFromCentre(w.page, grip, -10, -20, 3));
    const resized = await plotRow('A-4');
    await expect.poll(() => liveRegion(w.page), { timeout: 5_000 }).toBe(
      `Plot A-4 resized to ${resized.width_m.toFixed(1)} × ${resized.length_m.toFixed(1)} m.`,
    );
    expect(await liveRegion(w.page)).not.toMatch(/(move|resize|plot):\d/);
    expect(w.errors).toEqual([]);
  });

  it('moves a plot 1 m for each Alt + arrow press, saved at once', async () => {
    const w = await openMap(1280);
    const before = await plotRow('K-3');
    const answers = patchAnswers(w.page);
    await plot(w.page, 'K-3').focus();
    for (let i = 0; i < 3; i++) await w.page.keyboard.press('Alt+ArrowRight');
    await expect.poll(() => answers.length, { timeout: 10_000 }).toBe(3);
    expect(answers).toEqual([200, 200, 200]);
    const after = await plotRow('K-3');
    expect(after.x_m).toBeCloseTo(before.x_m + 3, 6); // computed: 3 × 1 m
    expect(after.y_m).toBe(before.y_m);
    await w.page.getByText('Alt + arrows move it 1 m', { exact: false }).waitFor();
    expect(w.errors).toEqual([]);
  });

  it('undoes a pointer move with the Undo button and a resize with Ctrl+Z, through the normal save', async () => {
    const w = await openMap(1280);
    const before = await plotRow('A-3');
    const box = (await plot(w.page, 'A-3').boundingBox())!;
    await savedAfter(w.page, () => dragFromCentre(w.page, box, 0, 10, 3));
    expect((await plotRow('A-3')).y_m).toBeGreaterThan(before.y_m);
    // The step is remembered once the save's answer is in; the button then names it.
    await savedAfter(w.page, () => w.page.getByRole('button', { name: 'Undo the move of plot A-3' }).click());
    await w.page.reload();
    await plot(w.page, 'A-3').waitFor();
    const undone = await plotRow('A-3');
    expect([undone.x_m, undone.y_m]).toEqual([before.x_m, before.y_m]);
    expect(undone.version).toBe(before.version + 2); // computed: the move and its undo are two saves
    const map = (await w.page.getByRole('group', { name: 'Map of Mossgate Lane' }).boundingBox())!;
    const shown = (await plot(w.page, 'A-3').boundingBox())!;
    const scale = map.width / 34; // the site is 34 m wide
    expect(Math.abs(shown.y - map.y - before.y_m * scale)).toBeLessThan(1.5);

    const k2 = await plotRow('K-2');
    await plot(w.page, 'K-2').focus();
    await savedAfter(w.page, () => w.page.keyboard.press('Shift+ArrowLeft'));
    expect((await plotRow('K-2')).width_m).toBeCloseTo(k2.width_m - 0.1, 6); // computed: one 0.1 m grid step
    await w.page.getByRole('button', { name: 'Undo the resize of plot K-2' }).waitFor();
    await savedAfter(w.page, () => w.page.keyboard.press('Control+z'));
    expect((await plotRow('K-2')).width_m).toBe(k2.width_m);
    expect(w.errors).toEqual([]);
  }, 60_000);

  for (const width of [1280, 390]) {
    it(`shows selects, the club switcher and small plots in full at ${width} px`, async () => {
      const w = await openMap(width);
      await plot(w.page, 'K-1').click();
      await w.page.getByRole('heading', { name: 'Plot K-1' }).waitFor();
      await w.page.getByLabel('Turned').waitFor();
      expect.soft(await clippedSelects(w.page)).toEqual([]);
      const small = (await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.name': 'Mossgate Lane' }).whereIn('p.kind', ['container', 'raised_bed']).whereNull('p.deleted_at').select('p.label')).map((r) => r.label as string);
      expect(small.length).toBe(9); // seeds: 6 raised beds and 3 containers on Mossgate Lane
      expect.soft(await unreadablePlots(w.page, small)).toEqual([]);
      // The full label is there on hover too.
      expect(await plot(w.page, 'K-1').getAttribute('title')).toMatch(/^Plot K-1/);
      await w.shot(`map-editor-${width}`);
      await openMenuIfClosed(w.page);
      const club = w.page.getByLabel('Club', { exact: true }).filter({ visible: true });
      await expect.poll(() => club.evaluate((el) => (el as HTMLSelectElement).selectedOptions[0]?.textContent)).toBe('Mossgate Community Garden Club');
      expect.soft(await clippedSelects(w.page)).toEqual([]);
      await w.shot(`map-editor-menu-${width}`);
      expect(w.errors).toEqual([]);
    });
  }
});
