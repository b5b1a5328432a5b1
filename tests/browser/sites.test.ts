import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { WatchedPage } from '../helpers/browser';
import { mainNav, seededServerAndBrowser, signInAs, signInAsCoordinator, switchClub } from '../helpers/session';

const suite = seededServerAndBrowser();

/** Signs the demo coordinator in and switches to the club that has the demo sites. */
async function signInToMossgate(width: number): Promise<WatchedPage> {
  // Maren's first club is Cinder Lane; the demo sites belong to Mossgate.
  const w = await signInAsCoordinator(suite.browser, suite.server.url, width, '/');
  await switchClub(w.page);
  return w;
}

async function openSites(w: WatchedPage) {
  await (await mainNav(w.page)).getByRole('link', { name: 'Sites' }).click();
  await w.page.getByRole('heading', { name: 'Sites', level: 1 }).waitFor();
}

const rowOf = (page: Page, text: string) => page.getByRole('row').filter({ hasText: text });

/** A real PNG of the given size (grey pixels), so the server's header checks read its width and height. */
function png(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const out = Buffer.alloc(body.length + 8);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(zlib.crc32(body), body.length + 4);
    return out;
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 0; // greyscale
  const rows = Buffer.alloc((width + 1) * height, 0x80);
  for (let y = 0; y < height; y++) rows[y * (width + 1)] = 0; // filter byte "none" at each row start
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', zlib.deflateSync(rows)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('sites and plots', () => {
  it('a coordinator opens Sites and sees both demo sites in their own units', async () => {
    const w = await signInToMossgate(1280);
    await openSites(w);
    // Sizes, path widths and frost dates as seeded in seeds/02-demo-sites.ts.
    const lane = rowOf(w.page, 'Mossgate Lane');
    const orchard = rowOf(w.page, 'Orchard Corner');
    await expect(lane.textContent()).resolves.toMatch(/Metric \(m\).*26.*0\.9 m.*34 × 22 m.*25 Apr – 20 Oct/);
    await expect(orchard.textContent()).resolves.toMatch(/US \(ft\).*17.*3 ft.*84 × 60 ft.*10 May – 5 Oct/);
    await expect(orchard.getByRole('link', { name: 'Map of Orchard Corner' }).getAttribute('href')).resolves.toMatch(
      /\/map\?site=\d+$/,
    );
    await w.shot('sites-1280');
    expect(w.errors).toEqual([]);
  });

  it('on a phone, the Orchard Corner plots table shows feet, downloads CSV and opens a plot with neighbours and history', async () => {
    const w = await signInToMossgate(390);
    await openSites(w);
    await w.page.getByRole('link', { name: 'Plots of Orchard Corner' }).click();
    await w.page.getByRole('heading', { name: 'Plots', level: 1 }).waitFor();

    // N-1 is seeded as a 10 × 20 ft in-ground plot with pH 6.8.
    const n1 = rowOf(w.page, 'N-1');
    await expect(n1.textContent()).resolves.toMatch(/N-1.*In-ground plot.*10 × 20 ft.*200 ft².*Full sun.*6\.8/);
    await expect(rowOf(w.page, 'RB-1').textContent()).resolves.toContain('8 × 4 ft');

    const csvHref = await w.page.getByRole('link', { name: 'Download CSV' }).getAttribute('href');
    expect(csvHref).toMatch(/^\/api\/sites\/\d+\/plots\.csv\?units=us$/);
    const csv = await w.page.request.get(`${suite.server.url}${csvHref}`);
    expect(csv.status()).toBe(200);
    expect(csv.headers()['content-type']).toContain('text/csv');
    const text = await csv.text();
    expect(text.replace(/^\uFEFF/, '').split('\r\n')[0]).toBe(
      'label,x,y,width,length,rotation,kind,soil_depth,soil_ph,soil_tested_on,sun,accessible,water_tap,notes',
    );
    expect(text).toMatch(/\r\nN-1,/);
    await expect(w.page.getByRole('link', { name: 'Template' }).getAttribute('href')).resolves.toMatch(
      /\/plot-imports\/template\.csv\?units=us$/,
    );
    await w.shot('site-plots-390');

    await w.page.getByRole('link', { name: 'N-2', exact: true }).click();
    await w.page.getByRole('heading', { name: 'Plot N-2' }).waitFor();
    // The demo club's newest season is 2026 (seeds/03) and N-2 was not held in it.
    await w.page.getByRole('region', { name: 'The 2026 season' }).getByText('Free for 2026').waitFor();
    const neighbours = w.page.getByRole('region', { name: 'Neighbours' });
    // N-3 starts 3 ft east of N-2 (13 ft spacing, 10 ft plots), the site's path width.
    await expect(neighbours.getByRole('listitem').filter({ hasText: 'N-3' }).textContent()).resolves.toContain(
      'To the east, across a 3 ft path',
    );
    const history = w.page.getByRole('region', { name: 'History' });
    await expect(history.getByRole('listitem').first().textContent()).resolves.toMatch(/Drawn on the map as N-2.*Maren Okafor/);
    await w.shot('plot-390');

    await neighbours.getByRole('link', { name: 'N-3' }).click();
    await w.page.getByRole('heading', { name: 'Plot N-3' }).waitFor();
    expect(w.errors).toEqual([]);
  });

  it('creates a new site in feet through the form and it appears in the table', async () => {
    const w = await signInToMossgate(1280);
    await openSites(w);
    await w.page.getByRole('button', { name: 'New site' }).click();
    const form = w.page.getByRole('region', { name: 'New site' });

    await form.getByRole('button', { name: 'Add site' }).click();
    await form.getByText('Enter a name').waitFor();
    await expect.poll(() => form.getByText('Enter a number').count(), { timeout: 5_000 }).toBe(4); // latitude, longitude, width, length

    await form.getByLabel('Name', { exact: true }).fill('Willow Allotment');
    await form.getByLabel('Latitude').fill('51.75');
    await form.getByLabel('Longitude').fill('-1.26');
    await form.getByLabel('Time zone').fill('Europe/London');
    await form.getByLabel('Units').selectOption('us');
    // A new site's starting path and grid switch to the round US numbers, not 2.95 ft.
    await expect.poll(() => form.getByLabel('Path width (ft)').inputValue(), { timeout: 5_000 }).toBe('3');
    await expect.poll(() => form.getByLabel('Snapping grid (ft)').inputValue(), { timeout: 5_000 }).toBe('1');
    await form.getByLabel('Width, west to east (ft)').fill('100');
    await form.getByLabel('Length, north to south (ft)').fill('50');
    await form.getByLabel('Last spring frost Month').selectOption({ label: 'April' });
    await form.getByLabel('Last spring frost Day').selectOption({ label: '20' });
    await form.getByLabel('First autumn frost Month').selectOption({ label: 'October' });
    await form.getByLabel('First autumn frost Day').selectOption({ label: '25' });
    await w.shot('site-new-1280');
    await form.getByRole('button', { name: 'Add site' }).click();

    await w.page.getByText('Willow Allotment is added').waitFor();
    const row = rowOf(w.page, 'Willow Allotment');
    await expect(row.textContent()).resolves.toMatch(/US \(ft\).*0.*3 ft.*100 × 50 ft.*20 Apr – 25 Oct/);

    // The edit form reads the metres back in feet, and switching units converts rather than relabels.
    await row.getByRole('link', { name: 'Edit Willow Allotment' }).click();
    await w.page.getByRole('heading', { name: 'Willow Allotment', level: 1 }).waitFor();
    await expect.poll(() => w.page.getByLabel('Width, west to east (ft)').inputValue(), { timeout: 5_000 }).toBe('100');
    await w.page.getByLabel('Units').selectOption('metric');
    // 100 ft = 30.48 m and 50 ft = 15.24 m exactly (NIST SP 811, B.8: 1 ft = 0.3048 m).
    await w.page.getByLabel('Width, west to east (m)').waitFor();
    await expect.poll(() => w.page.getByLabel('Width, west to east (m)').inputValue(), { timeout: 5_000 }).toBe('30.48');
    await expect.poll(() => w.page.getByLabel('Length, north to south (m)').inputValue(), { timeout: 5_000 }).toBe('15.24');
    expect(w.errors).toEqual([]);
  });

  it('a CSV with one bad row shows the row and saves nothing; the fixed file imports every row', async () => {
    const w = await signInToMossgate(1280);
    await openSites(w);
    await w.page.getByRole('link', { name: 'Plots of Mossgate Lane' }).click();
    await w.page.getByText('26 plots, sizes in metres').waitFor();

    // Free ground on the seeded 34 × 22 m site: east of the herb bed, south of the raised beds.
    const bad = 'label,x,y,width,length\nT-1,10,19,3,2\nT-2,14,19,0,2\n';
    await w.page.getByLabel('CSV file', { exact: true }).setInputFiles({ name: 'new-plots.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    await expect.poll(() => w.page.getByLabel('Plot rows').inputValue()).toBe(bad);
    await w.page.getByRole('button', { name: 'Check file' }).click();

    const problems = w.page.getByRole('list', { name: 'Problems by row' });
    await problems.waitFor();
    await expect(problems.getByRole('listitem').allTextContents()).resolves.toEqual(['Row 3, width: Must be more than 0']);
    await w.page.getByText('Nothing is saved until every row is right.').first().waitFor();
    await expect(w.page.getByRole('button', { name: /^Import/ }).isDisabled()).resolves.toBe(true);
    await w.shot('plot-import-errors-1280');

    // Checking saved nothing: the table still has no T-1 after a reload.
    await w.page.reload();
    await w.page.getByText('26 plots, sizes in metres').waitFor();
    await expect(w.page.getByRole('link', { name: 'T-1', exact: true }).count()).resolves.toBe(0);

    await w.page.getByLabel('Plot rows').fill(bad.replace('T-2,14,19,0,2', 'T-2,14,19,3,2'));
    await w.page.getByRole('button', { name: 'Check file' }).click();
    await w.page.getByText('All 2 rows are ready').waitFor();
    await w.page.getByRole('button', { name: 'Import 2 plots' }).click();

    await w.page.getByText('Imported 2 plots').waitFor();
    await w.page.getByText('28 plots, sizes in metres').waitFor();
    // 28 plots run past the first page of 25; the filter finds the new ones.
    await w.page.getByLabel('Filter plots').fill('T-');
    await w.page.getByText('Showing 1–2 of 2').waitFor();
    await expect.poll(() => rowOf(w.page, 'T-2').textContent(), { timeout: 5_000 }).toMatch(/T-2.*In-ground plot.*3 × 2 m.*6 m².*Full sun.*Not tested/);
    await w.shot('plot-import-done-1280');
    expect(w.errors).toEqual([]);
  });

  it('uploads a map background with its real width, then removes it', async () => {
    const w = await signInToMossgate(1280);
    await openSites(w);
    await w.page.getByRole('link', { name: 'Edit Mossgate Lane' }).click();
    const background = w.page.getByRole('region', { name: 'Map background' });
    await background.getByText('No background yet').waitFor();

    // The quick client-side check answers before anything is sent.
    await background.getByLabel('Background image').setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('hello') });
    await background.getByRole('button', { name: 'Upload background' }).click();
    await background.getByText('Use a PNG, JPEG or WebP image').waitFor();

    // A file that says it is a PNG but is not passes the quick check; the server's refusal is said once.
    await background.getByLabel('Background image').setInputFiles({ name: 'fake.png', mimeType: 'image/png', buffer: Buffer.from('hello') });
    const refused = w.page.waitForResponse((r) => r.url().includes('/background') && r.request().method() !== 'GET');
    await background.getByRole('button', { name: 'Upload background' }).click();
    expect((await refused).status()).toBe(400);
    // The server's words (server/services/site-backgrounds.ts) for a file it cannot read as an image.
    const refusal = background.getByText('The file is not an image we can read; use a PNG, JPEG or WebP image');
    await refusal.first().waitFor();
    expect(await refusal.count()).toBe(1);
    await w.shot('site-background-refused-1280');
    await w.page.setViewportSize({ width: 390, height: 860 });
    await w.shot('site-background-refused-390');
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.page.setViewportSize({ width: 1280, height: 860 });

    await background.getByLabel('Background image').setInputFiles({ name: 'aerial.png', mimeType: 'image/png', buffer: png(340, 220) });
    await background.getByLabel('Real width the image covers (m)').fill('34');
    await background.getByRole('button', { name: 'Upload background' }).click();
    await background.getByText('Uploaded aerial.png').waitFor();
    await background.getByText('340 × 220 pixels. It spans 34 m across.').waitFor();
    await expect.poll(() => background.getByLabel('Replace with a new image').inputValue(), { timeout: 5_000 }).toBe('');
    const img = background.getByRole('img', { name: 'The current map background of Mossgate Lane' });
    // The browser really loaded the stored file, not just the markup.
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(340);
    await w.shot('site-background-1280');

    await background.getByRole('button', { name: 'Remove background' }).click();
    await background.getByRole('button', { name: 'Yes, remove it' }).click();
    await background.getByText('No background yet').waitFor();
    // The browser itself logs the refused upload; nothing else may be logged.
    expect(w.errors.filter((e) => !/status of 400/.test(e))).toEqual([]);
  });

  it('a plot holder can read a plot page but not manage sites', async () => {
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390, '/');
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    const clubPath = new URL(w.page.url()).pathname;
    const sites = await (await w.page.request.get(`${suite.server.url}/api${clubPath}/sites`)).json();
    const lane = sites.items.find((site: { name: string }) => site.name === 'Mossgate Lane');
    const plots = await (await w.page.request.get(`${suite.server.url}/api/sites/${lane.id}/plots`)).json();
    const b4 = plots.items.find((plot: { label: string }) => plot.label === 'B-4');

    await w.page.goto(`${suite.server.url}${clubPath}/plots/${b4.id}`);
    await w.page.getByRole('heading', { name: 'Plot B-4' }).waitFor();
    // B-4 is the seeded plot with the water tap; A-4 lies 0.9 m north across the path.
    await expect.poll(() => w.page.getByRole('region', { name: 'About this plot' }).textContent(), { timeout: 5_000 }).toContain('Yes, at the plot');
    const neighbours = w.page.getByRole('region', { name: 'Neighbours' });
    await expect(neighbours.getByRole('listitem').filter({ hasText: 'A-4' }).textContent()).resolves.toContain(
      'To the north, across a 0.9 m path',
    );
    await expect(w.page.getByRole('link', { name: 'Edit on the map' }).count()).resolves.toBe(0);

    await w.page.goto(`${suite.server.url}${clubPath}/sites`);
    await w.page.getByRole('heading', { name: 'This page is for coordinators' }).waitFor();
    expect(w.errors).toEqual([]);
  });

  it('a save over someone else’s change says so and shows the saved site', async () => {
    const w = await signInToMossgate(1280);
    await openSites(w);
    await w.page.getByRole('link', { name: 'Edit Orchard Corner' }).click();
    await w.page.getByRole('heading', { name: 'Orchard Corner', level: 1 }).waitFor();
    const siteId = Number(/\/sites\/(\d+)\/edit/.exec(w.page.url())![1]);

    // Another coordinator's tab changes the soil notes while this form is open.
    const session = await (await w.page.request.get(`${suite.server.url}/api/session`)).json();
    const current = await (await w.page.request.get(`${suite.server.url}/api/sites/${siteId}`)).json();
    const elsewhere = await w.page.request.patch(`${suite.server.url}/api/sites/${siteId}`, {
      headers: { 'X-CSRF-Token': session.csrfToken },
      data: { version: current.version, soilNotes: 'Mulched in November.' },
    });
    expect(elsewhere.status()).toBe(200);

    await w.page.getByLabel('Name', { exact: true }).fill('Orchard Corner East');
    await w.page.getByRole('button', { name: 'Save changes' }).click();
    await w.page.getByText('Someone else changed this site while you were editing.').waitFor();
    await expect.poll(() => w.page.getByLabel('Soil notes').inputValue()).toBe('Mulched in November.');
    await expect(w.page.getByLabel('Name', { exact: true }).inputValue()).resolves.toBe('Orchard Corner');

    await w.page.getByLabel('Name', { exact: true }).fill('Orchard Corner East');
    await w.page.getByRole('button', { name: 'Save changes' }).click();
    await w.page.getByText('Saved the changes to Orchard Corner East.').waitFor();
    await w.shot('site-edit-saved-1280');
    // The browser itself logs the refused request; nothing else may be logged.
    expect(w.errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
    expect(w.errors.filter((e) => /status of 409/.test(e))).toHaveLength(1);
  });
});
