import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { formatDateTime } from '@shared/dates';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import type { WatchedPage } from '../helpers/browser';
import { DEMO_CLUB, mainNav, seededServerAndBrowser, signInAs, signInAsCoordinator, switchClub } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// The demo people and their roles in Mossgate (seeds/01-demo-club.ts); Teodor held A-1 in 2026 and paid (seeds/03).
const VOLUNTEER = 'lucia@example.org';
const HOLDER = 'teodor@example.org';

let clubId = 0;
let siteId = 0;
let plotId = 0;
beforeAll(async () => {
  clubId = (await db('clubs').where({ slug: 'mossgate' }).first('id')).id;
  siteId = (await db('sites').where({ club_id: clubId, name: 'Mossgate Lane' }).first('id')).id;
  plotId = (await db('plots').where({ site_id: siteId, label: 'A-1' }).first('id')).id;
});

async function memberOn(email: string, width: number): Promise<WatchedPage> {
  const w = await signInAs(suite.browser, suite.server.url, email, width);
  await w.page.getByRole('heading', { name: DEMO_CLUB }).waitFor();
  return w;
}

/** API paths only a coordinator may read; a page shown to anyone else should not even ask for them. */
const COORDINATOR_API = /\/api\/(clubs\/\d+\/(members|invites|waitlist|fees|outbox|mailings)|seasons\/\d+\/left-out|sites\/\d+\/(tasks|task-runs))/;
function coordinatorRequests(page: Page): string[] {
  const seen: string[] = [];
  page.on('request', (r) => {
    if (COORDINATOR_API.test(new URL(r.url()).pathname)) seen.push(new URL(r.url()).pathname);
  });
  return seen;
}

/** Pages only coordinators use, with a control each offers a coordinator. */
const coordinatorPages = (): Array<[path: string, control: (p: Page) => ReturnType<Page['getByRole']>]> => [
  ['/spring-round', (p) => p.getByRole('button', { name: 'Review and open the season' })],
  ['/sites', (p) => p.getByRole('heading', { name: 'Sites', exact: true })],
  [`/sites/${siteId}/edit`, (p) => p.getByRole('button', { name: 'Save changes' })],
  ['/waitlist', (p) => p.getByRole('heading', { name: 'Waiting list', exact: true })],
  ['/fees', (p) => p.getByRole('heading', { name: 'Fees', exact: true })],
  ['/members', (p) => p.getByRole('link', { name: 'Invite someone' })],
  ['/messages', (p) => p.getByRole('heading', { name: 'Write a message' })],
  ['/outgoing-mail', (p) => p.getByRole('heading', { name: 'Outgoing mail', exact: true })],
  ['/settings', (p) => p.getByRole('heading', { name: 'Settings', exact: true })],
  ['/tasks', (p) => p.getByRole('link', { name: 'Tasks at Mossgate Lane' })],
  [`/sites/${siteId}/tasks`, (p) => p.getByRole('button', { name: 'Make tasks now' })],
];

/** Pages every member opens, with the heading that says the page has loaded and the coordinator's controls on it. */
const sharedPages = (): Array<[path: string, heading: string, controls: Array<(p: Page) => ReturnType<Page['getByRole']>>]> => [
  ['', DEMO_CLUB, [(p) => p.getByRole('link', { name: /^Spring round/ }), (p) => p.getByRole('link', { name: /^Members/ })]],
  [
    '/map',
    'Map of Mossgate Lane',
    [(p) => p.getByRole('button', { name: 'Add plot' }), (p) => p.getByRole('link', { name: 'Site settings' }), (p) => p.getByRole('main').getByRole('link', { name: 'Tasks', exact: true })],
  ],
  [`/sites/${siteId}/water`, 'Water at Mossgate Lane', [(p) => p.getByRole('link', { name: 'Watering tasks' })]],
  [`/sites/${siteId}/plots`, 'Plots', [(p) => p.getByRole('heading', { name: 'Import plots from a CSV file' }), (p) => p.getByRole('link', { name: 'Edit site' })]],
  [`/plots/${plotId}`, 'Plot A-1', [(p) => p.getByRole('link', { name: 'Edit on the map' })]],
];

describe('who sees what', () => {
  for (const [who, email] of [
    ['volunteer', VOLUNTEER],
    ['plot holder', HOLDER],
  ] as const) {
    it(`a ${who} is offered no coordinator's control on any page and asks for no coordinator's data`, async () => {
      const w = await memberOn(email, 1280);
      const asked = coordinatorRequests(w.page);
      for (const [path, heading, controls] of sharedPages()) {
        await w.page.goto(`${suite.server.url}/clubs/${clubId}${path}`);
        await w.page.getByRole('heading', { name: heading, exact: true }).first().waitFor();
        await w.page.waitForLoadState('networkidle');
        for (const control of controls) expect({ path, count: await control(w.page).count() }).toEqual({ path, count: 0 });
      }
      for (const [path, control] of coordinatorPages()) {
        await w.page.goto(`${suite.server.url}/clubs/${clubId}${path}`);
        await w.page.getByRole('heading', { name: 'This page is for coordinators' }).waitFor();
        await w.page.waitForLoadState('networkidle');
        expect({ path, count: await control(w.page).count() }).toEqual({ path, count: 0 });
      }
      expect(asked).toEqual([]);
      const nav = await mainNav(w.page);
      expect(await nav.getByRole('link', { name: 'Spring round' }).count()).toBe(0);
      expect(w.errors).toEqual([]);
    }, 60_000);
  }

  it('a coordinator still sees every one of those controls', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await switchClub(w.page);
    for (const [path, heading, controls] of sharedPages()) {
      await w.page.goto(`${suite.server.url}/clubs/${clubId}${path}`);
      await w.page.getByRole('heading', { name: heading, exact: true }).first().waitFor();
      for (const control of controls) await control(w.page).first().waitFor();
    }
    for (const [path, control] of coordinatorPages()) {
      await w.page.goto(`${suite.server.url}/clubs/${clubId}${path}`);
      await control(w.page).first().waitFor();
    }
    expect(w.errors).toEqual([]);
  }, 60_000);
});

describe('a plot holder’s own plot on the club home', () => {
  it('shows a volunteer no plot section', async () => {
    const w = await memberOn(VOLUNTEER, 390);
    await w.page.getByRole('heading', { name: 'Volunteering' }).waitFor();
    expect(await w.page.getByRole('heading', { name: 'My plot' }).count()).toBe(0);
    expect(w.errors).toEqual([]);
  });

  it('shows the renewal with its deadline; the link answers it; the phone map pans with a drag and zooms', async () => {
    // The coordinator opens the 2027 season, so Teodor (paid for 2026) gets a renewal.
    const c = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await c.page.goto(`${suite.server.url}/clubs/${clubId}/spring-round`);
    await c.page.getByRole('button', { name: 'Review and open the season' }).click();
    await c.page.getByRole('dialog', { name: 'Open the 2027 season?' }).getByRole('button', { name: /^Open and send \d+ renewals?$/ }).click();
    await c.page.getByRole('heading', { name: 'Spring round 2027' }).waitFor();
    const teodor = await db('users').where({ email: HOLDER }).first('id');
    const renewal = await db('renewals').where({ user_id: teodor.id, status: 'pending' }).first('id', 'deadline');

    const w = await memberOn(HOLDER, 390);
    const section = w.page.getByRole('region', { name: 'My plot' });
    await section.getByText('Keep plot A-1 for 2027?').waitFor();
    // computed: the stored deadline shown in the club's zone (Europe/London, seeds/03-demo-spring-round.ts);
    // a December deadline in London is on GMT (common practice: UK winter time).
    const deadline = formatDateTime(renewal.deadline.toISOString(), 'Europe/London');
    expect(deadline).toMatch(/GMT/);
    await section.getByText(deadline).waitFor();
    const facts = section.locator('dl');
    // seeds/02-demo-sites.ts draws A-1 on Mossgate Lane; the 2026 allocation is seeds/03.
    await expect.poll(() => facts.innerText()).toMatch(/Plot\s+A-1\s+Site\s+Mossgate Lane\s+Size\s+.+\s+Season\s+2026/);
    expect(await section.getByText('Ines', { exact: false }).count()).toBe(0);

    // "Your plot" is a word label on an outlined shape, inside the visible map box.
    const map = w.page.getByTestId('plot-viewer');
    const yours = map.locator('[data-your-plot]');
    const label = map.getByText('Your plot A-1');
    await label.waitFor();
    await map.scrollIntoViewIfNeeded();
    const boxArea = (await map.boundingBox())!;
    const labelBox = (await label.boundingBox())!;
    expect(labelBox.x).toBeGreaterThanOrEqual(boxArea.x);
    expect(labelBox.x + labelBox.width).toBeLessThanOrEqual(boxArea.x + boxArea.width);
    expect(labelBox.y).toBeGreaterThanOrEqual(boxArea.y);
    expect(await yours.evaluate((el) => getComputedStyle(el).outlineStyle)).toBe('solid');
    await w.shot('home-plot-holder-renewal-phone');

    // A real pointer drag (down, move, up) pans the map by the distance dragged.
    const before = (await yours.boundingBox())!;
    const start = { x: boxArea.x + boxArea.width / 2, y: boxArea.y + boxArea.height / 2 };
    await w.page.mouse.move(start.x, start.y);
    await w.page.mouse.down();
    await w.page.mouse.move(start.x - 60, start.y - 40, { steps: 8 });
    await w.page.mouse.up();
    // computed: the plot moves with the pointer, 60 px left and 40 px up
    await expect.poll(async () => Math.round((await yours.boundingBox())!.x - before.x)).toBe(-60);
    await expect.poll(async () => Math.round((await yours.boundingBox())!.y - before.y)).toBe(-40);

    // Zoom in: each step is × 1.5 (the viewer's ZOOM_STEP), unless it is already at its largest.
    const width0 = (await yours.boundingBox())!.width;
    await w.page.getByRole('button', { name: 'Zoom in' }).click();
    // computed: width0 × 1.5
    await expect.poll(async () => Math.round((await yours.boundingBox())!.width)).toBe(Math.round(width0 * 1.5));
    await w.page.getByRole('button', { name: 'Zoom out' }).click();
    await w.page.getByRole('button', { name: 'Zoom out' }).click();
    // computed: width0 × 1.5 ÷ 1.5 ÷ 1.5 = width0 ÷ 1.5
    await expect.poll(async () => Math.round((await yours.boundingBox())!.width)).toBe(Math.round(width0 / 1.5));
    await w.page.getByRole('button', { name: 'Back to my plot' }).click();
    await expect.poll(async () => Math.round((await yours.boundingBox())!.width)).toBe(Math.round(before.width));
    await w.shot('home-plot-holder-map-phone');

    // The link opens the same answer page as the e-mail, for this renewal.
    await section.getByRole('link', { name: 'Answer the renewal' }).click();
    await w.page.getByRole('heading', { name: 'Keep your plot?' }).waitFor();
    await w.page.getByText('A-1, Mossgate Lane').waitFor();
    await w.page.getByText(deadline).waitFor();
    await w.shot('renewal-answer-signed-in-phone');
    await w.page.getByRole('button', { name: 'Keep my plot' }).click();
    await w.page.getByText('Plot A-1 is yours for 2027.', { exact: false }).waitFor();
    expect((await db('renewals').where({ id: renewal.id }).first('status')).status).toBe('kept');

    await w.page.goto(`${suite.server.url}/clubs/${clubId}`);
    await expect.poll(() => section.locator('dl').innerText()).toMatch(/Season\s+2027/);
    expect(await section.getByText('Keep plot A-1 for 2027?').count()).toBe(0);
    expect(w.errors).toEqual([]);
    expect(c.errors).toEqual([]);
  }, 60_000);

  it('club home screenshots for each role at desktop and phone width', async () => {
    for (const width of [1280, 390]) {
      const c = await signInAsCoordinator(suite.browser, suite.server.url, width);
      await switchClub(c.page);
      await c.shot(`home-coordinator-${width}`);
      for (const [who, email] of [
        ['volunteer', VOLUNTEER],
        ['plot-holder', HOLDER],
      ] as const) {
        const w = await memberOn(email, width);
        if (who === 'plot-holder') await w.page.getByText('Your plot A-1').waitFor();
        await w.page.waitForLoadState('networkidle');
        await w.shot(`home-${who}-${width}`);
        expect(w.errors).toEqual([]);
        await w.page.context().close();
      }
      expect(c.errors).toEqual([]);
      await c.page.context().close();
    }
  }, 60_000);
});
