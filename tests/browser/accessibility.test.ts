import { describe, expect, it } from 'vitest';
import { rangeLabel, thisWeek } from '@/features/shifts/lib/dates';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { openPage } from '../helpers/browser';
import { seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();

// WCAG 2.1 AA as checked by axe-core (Deque's open rule set): contrast, names, labels, landmarks.
describe('accessibility (axe-core, WCAG 2.1 A and AA)', () => {
  it('finds no violations on the public pages, at desktop and phone width', async () => {
    for (const width of [1280, 390]) {
      for (const path of ['/sign-in', '/forgot-password', '/start-a-club', '/apply/mossgate']) {
        const w = await openPage(suite.browser, width);
        await w.page.goto(`${suite.server.url}${path}`);
        await w.page.getByRole('heading').first().waitFor();
        expect({ path, width, violations: await axeViolations(w.page) }).toEqual({ path, width, violations: [] });
        await w.page.context().close();
      }
      // Links from e-mails that no longer work end on designed pages, checked the same way.
      for (const [path, heading] of [
        ['/respond/offer?token=abc&answer=accept', 'This link is not valid'],
        ['/reset-password?token=abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG', "This reset link doesn't work"],
        ['/stop-mail?token=abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG', 'This link is not valid'],
      ]) {
        const w = await openPage(suite.browser, width);
        await w.page.goto(`${suite.server.url}${path}`);
        await w.page.getByRole('heading', { name: heading }).waitFor();
        expect({ path, width, violations: await axeViolations(w.page) }).toEqual({ path, width, violations: [] });
        await w.page.context().close();
      }
    }
  }, 60_000);

  it("finds no violations on the coordinator's pages, at desktop and phone width", async () => {
    const db = createDb(testConfig().databaseUrl);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const lane = await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
    const shift = await db('shifts').where({ club_id: club.id }).where('starts_at', '>', new Date()).orderBy('starts_at').first('id', 'title');
    const zone = (await db('clubs').where({ id: club.id }).first('time_zone')).time_zone;
    await db.destroy();
    // The printed rota opens on this week at the club (its zone), titled with the week's dates.
    const week = thisWeek(zone);
    const pages: Array<[string, string]> = [
      ['', 'Mossgate Community Garden Club'],
      ['/map', 'Map of Mossgate Lane'],
      ['/sites', 'Sites'],
      ['/spring-round', 'Spring round 2026'],
      ['/waitlist', 'Waiting list'],
      ['/fees', 'Fees'],
      ['/members', 'Members'],
      ['/messages', 'Messages'],
      ['/outgoing-mail', 'Outgoing mail'],
      ['/outgoing-mail/templates', 'E-mail templates'],
      ['/settings', 'Settings'],
      ['/findings', 'Neighbour check'],
      ['/tasks', 'Tasks'],
      [`/sites/${lane.id}/tasks`, 'Tasks at Mossgate Lane'],
      [`/sites/${lane.id}/water`, 'Water at Mossgate Lane'],
      ['/shifts', 'Shifts'],
      ['/shifts?view=calendar', 'Shifts'],
      ['/shifts?view=calendar&cal=week', 'Shifts'],
      ['/shifts?view=calendar&cal=agenda', 'Shifts'],
      ['/shifts/plan', 'Build shifts'],
      [`/shifts/${shift.id}`, shift.title],
      ['/hours', 'Volunteer hours'],
      [`/sites/${lane.id}/print`, 'Mossgate Lane: site map'],
      ['/shifts/print', `Shift rota, ${rangeLabel(week.from, week.to)}`],
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
  }, 300_000); // twenty-four pages at two widths, each with an axe run

  it("finds no violations on a plot holder's and a volunteer's pages, the home with its map included", async () => {
    const db = createDb(testConfig().databaseUrl);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const a1 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.club_id': club.id, 'p.label': 'A-1' }).first('p.id');
    const radish = await db('crops').whereNull('club_id').where({ slug: 'radish' }).first('id');
    const lane = await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
    await db.destroy();
    const people: Array<[string, Array<[string, string]>]> = [
      [
        'teodor@example.org',
        [
          ['', 'Mossgate Community Garden Club'],
          [`/plots/${a1.id}`, 'Plot A-1'],
          [`/plots/${a1.id}/book`, 'Plot book: A-1'],
          ['/crops', 'Crop notes'],
          ['/harvests', 'Harvests'],
          [`/crops/${radish.id}`, 'Radish'],
          ['/email-choices', 'E-mail choices'],
          [`/sites/${lane.id}/water`, 'Water at Mossgate Lane'],
        ],
      ],
      [
        'lucia@example.org',
        [
          ['', 'Mossgate Community Garden Club'],
          ['/email-choices', 'E-mail choices'],
          ['/shifts', 'Shifts'],
          ['/my-shifts', 'My shifts'],
        ],
      ],
    ];
    for (const width of [1280, 390]) {
      for (const [email, pages] of people) {
        const w = await signInAs(suite.browser, suite.server.url, email, width);
        await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
        for (const [path, heading] of pages) {
          await w.page.goto(`${suite.server.url}/clubs/${club.id}${path}`);
          await w.page.getByRole('heading', { name: heading, exact: true }).first().waitFor();
          // The holder's home draws their plot on the site map: check the page once the map is there.
          if (email === 'teodor@example.org' && path === '') await w.page.getByTestId('plot-viewer').waitFor();
          await w.page.waitForLoadState('networkidle');
          expect({ email, path, width, violations: await axeViolations(w.page) }).toEqual({ email, path, width, violations: [] });
        }
        expect(w.errors).toEqual([]);
        await w.page.context().close();
      }
    }
  }, 120_000);
});
