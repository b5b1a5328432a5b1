import { describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { openPage } from '../helpers/browser';
import { seededServerAndBrowser, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();

// WCAG 2.1 AA as checked by axe-core (Deque's open rule set): contrast, names, labels, landmarks.
describe('accessibility (axe-core, WCAG 2.1 A and AA)', () => {
  it('finds no violations on the public pages, at desktop and phone width', async () => {
    for (const width of [1280, 390]) {
      for (const path of ['/sign-in', '/forgot-password', '/apply/mossgate']) {
        const w = await openPage(suite.browser, width);
        await w.page.goto(`${suite.server.url}${path}`);
        await w.page.getByRole('heading').first().waitFor();
        expect({ path, width, violations: await axeViolations(w.page) }).toEqual({ path, width, violations: [] });
        await w.page.context().close();
      }
    }
  });

  it("finds no violations on the coordinator's pages, at desktop and phone width", async () => {
    const db = createDb(testConfig().databaseUrl);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    await db.destroy();
    const pages: Array<[string, string]> = [
      ['', 'Mossgate Community Garden Club'],
      ['/map', 'Map of Mossgate Lane'],
      ['/sites', 'Sites'],
      ['/spring-round', 'Spring round 2026'],
      ['/waitlist', 'Waiting list'],
      ['/fees', 'Fees'],
      ['/members', 'Members'],
      ['/outgoing-mail', 'Outgoing mail'],
      ['/settings', 'Settings'],
    ];
    for (const width of [1280, 390]) {
      const w = await signInAsCoordinator(suite.browser, suite.server.url, width);
      for (const [path, heading] of pages) {
        await w.page.goto(`${suite.server.url}/clubs/${club.id}${path}`);
        await w.page.getByRole('heading', { name: heading, exact: true }).first().waitFor();
        await w.page.waitForLoadState('networkidle');
        expect({ path, width, violations: await axeViolations(w.page) }).toEqual({ path, width, violations: [] });
      }
      expect(w.errors).toEqual([]);
      await w.page.context().close();
    }
  }, 120_000); // eight pages at two widths, each with an axe run
});
