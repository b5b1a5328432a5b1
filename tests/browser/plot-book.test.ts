import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

describe('the plot book', () => {
  it('a holder on a phone adds a radish planting on part of the plot, sees its plant count and dates, logs a harvest and a pest with a photo', async () => {
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    // One tap from home.
    await w.page.getByRole('link', { name: 'Open the plot book' }).click();
    await w.page.getByRole('heading', { name: 'Plot book: A-1' }).waitFor();
    // The demo history (seeds/04): 2026's tomato, earlier seasons listed.
    await w.page.getByRole('region', { name: 'Plantings in 2026' }).getByRole('heading', { name: /^Tomato/ }).waitFor();
    await w.page.getByRole('region', { name: 'Earlier seasons' }).getByRole('link', { name: '2023' }).waitFor();
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('plot-book-phone');

    await w.page.getByRole('button', { name: 'Add a planting' }).click();
    // The planting form sits in this season's plantings; "what fits here" has a part picker of its own.
    const form = w.page.getByRole('region', { name: 'Plantings in 2026' });
    await form.getByLabel('Find a crop').fill('rad');
    await form.getByLabel('Crop', { exact: true }).selectOption({ label: 'Radish' });
    await form.getByLabel('Variety (optional)').fill('Sparkler');
    await form.getByLabel('The whole plot').uncheck();
    // Draw the part with a real pointer: press near the top-left of the plot drawing, drag, let go.
    const drawing = form.getByRole('img', { name: /^Plot drawing: the part marked is/ });
    await drawing.scrollIntoViewIfNeeded();
    const box = (await drawing.boundingBox())!;
    await w.page.mouse.move(box.x + box.width * 0.1, box.y + box.height * 0.55);
    await w.page.mouse.down();
    for (let i = 1; i <= 8; i++) await w.page.mouse.move(box.x + box.width * (0.1 + 0.05 * i), box.y + box.height * (0.55 + 0.04 * i));
    await w.page.mouse.up();
    // The boxes follow the drag: the starting half-plot (1.5 × 3 m at the corner) has moved and changed.
    const widthBox = form.getByLabel('Width (m)');
    const drawn = {
      width: Number(await widthBox.inputValue()),
      length: Number(await form.getByLabel('Length (m)').inputValue()),
      x: Number(await form.getByLabel('From the left (m)').inputValue()),
      y: Number(await form.getByLabel('From the top (m)').inputValue()),
    };
    expect(drawn.y).toBeGreaterThan(2);
    expect(drawn.length).not.toBe(3);
    await form.getByLabel('Date', { exact: false }).first().fill('2026-09-01');
    await form.getByLabel('Rows (optional)').fill('3');
    await w.shot('plot-book-new-planting-phone');
    await form.getByRole('button', { name: 'Save the planting' }).click();
    await w.page.getByText('Radish ‘Sparkler’ saved. Its dates are below.').waitFor();

    // The saved row is the part that was drawn, inside the plot.
    const a1 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 'p.label': 'A-1', 's.name': 'Mossgate Lane' }).first('p.id', 'p.width_m', 'p.length_m');
    const row = await db('plantings as pl').join('crops as c', 'c.id', 'pl.crop_id').where({ 'pl.plot_id': a1.id, 'pl.variety': 'Sparkler' }).first('pl.*', 'c.slug');
    expect(row.slug).toBe('radish');
    expect({ width: row.part_width_m, length: row.part_length_m, x: row.part_x_m, y: row.part_y_m }).toEqual(drawn);
    expect(row.part_x_m + row.part_width_m).toBeLessThanOrEqual(a1.width_m);
    expect(row.part_y_m + row.part_length_m).toBeLessThanOrEqual(a1.length_m);
    expect(Number(await widthBox.count())).toBe(0); // the form closed

    // The card shows what the server worked out (shared/plot-book), in the page's words.
    const book = await w.page.request.get(`${suite.server.url}/api/plots/${a1.id}/book`);
    const planting = (await book.json()).plantings.find((p: { variety: string }) => p.variety === 'Sparkler');
    const card = w.page.getByRole('article', { name: 'Radish ‘Sparkler’' });
    await card.getByText(new RegExp(`^${planting.computed.plantsThatFit.plants} \\(3 rows of ${planting.computed.plantsThatFit.perRow}`)).waitFor();
    await card.getByText('Comes up', { exact: true }).waitFor();
    await card.getByText('Harvest', { exact: true }).waitFor();
    // Radish: 25–50 days from sowing (Encyclopaedia Britannica, in the crop notes): 1 Sep 2026 + 25 days = 26 Sep 2026 (computed).
    expect(planting.computed.harvestWindow.earliest).toBe('2026-09-26');
    await card.getByText(/26 Sep 2026 to /).waitFor();

    await card.getByRole('button', { name: 'Log a harvest of Radish ‘Sparkler’' }).click();
    await card.getByLabel('Picked on').fill('2026-10-03');
    // A weight that is not a number is caught on the form, and what was typed stays.
    await card.getByLabel('Weight').fill('lots');
    await card.getByRole('button', { name: 'Save the harvest' }).click();
    await card.getByText('A number, like 1.5').waitFor();
    expect(await card.getByLabel('Picked on').inputValue()).toBe('2026-10-03');
    await card.getByLabel('Weight').fill('1.2');
    await card.getByRole('button', { name: 'Save the harvest' }).click();
    await card.getByText('1.2 kg in 1 picking').waitFor();
    expect((await db('harvests').where({ planting_id: row.id }).first('grams')).grams).toBe(1200);

    // A pest with a photo: the photo is checked and re-encoded by the server.
    const photo = await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 90, g: 140, b: 60 } } }).jpeg().toBuffer();
    await w.page.getByRole('button', { name: 'Record what you saw' }).click();
    await w.page.getByRole('button', { name: 'Save the observation' }).click();
    await w.page.getByText('Choose what you saw').waitFor();
    await w.page.getByLabel('What did you see?').selectOption({ label: 'Slugs and snails' });
    await w.page.getByLabel('How bad').selectOption('moderate');
    await w.page.getByLabel('Seen on').fill('2026-09-20');
    await w.page.getByLabel('On which planting (optional)').selectOption({ label: 'Radish ‘Sparkler’' });
    await w.page.getByLabel(/^Photos/).setInputFiles({ name: 'slugs.jpg', mimeType: 'image/jpeg', buffer: photo });
    await w.page.getByRole('button', { name: 'Save the observation' }).click();
    const thumb = w.page.getByRole('img', { name: 'Slugs and snails, photo 1 of 1' });
    await thumb.waitFor();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(320);
    await thumb.scrollIntoViewIfNeeded();
    await w.shot('plot-book-observation-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 90_000);

  it('the coordinator opens the same plot book from the map on a desktop', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const a1 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 'p.label': 'A-1', 's.name': 'Mossgate Lane' }).first('p.id', 's.id as site_id');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/map?site=${a1.site_id}&plot=${a1.id}`);
    await w.page.getByRole('heading', { name: 'Plot A-1' }).waitFor();
    await w.page.getByRole('link', { name: 'Plot book' }).click();
    await w.page.getByRole('heading', { name: 'Plot book: A-1' }).waitFor();
    await w.page.getByRole('heading', { name: 'Radish ‘Sparkler’' }).waitFor();
    await w.page.getByRole('region', { name: 'Pests and diseases' }).getByText('Slugs and snails').first().waitFor();
    await w.shot('plot-book-desktop');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 60_000);
});
