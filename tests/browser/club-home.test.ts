import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addCalendarDays, localToday } from '@shared/dates';
import { formatMoney } from '@shared/fees/compute';
import { formatWeight } from '@shared/plot-book';
import { SeasonSummarySchema } from '@shared/schemas/season-summary';
import { MyShiftsSchema, ShiftListSchema } from '@shared/schemas/shifts';
import { PlotBookSchema } from '@shared/schemas/plot-book';
import { MyPlotSchema } from '@shared/schemas/my-plot';
import { createDb } from '../../server/db/knex';
import { mondayOf } from '../../server/services/season-summary';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();

// Demo sign-ins from README.md: Teodor holds A-1, Lucía volunteers (and holds a place on the first compost shift).
const HOLDER = 'teodor@example.org';
const VOLUNTEER = 'lucia@example.org';
const WIDTHS = [1280, 390] as const;

async function mossgate() {
  const db = createDb(testConfig().databaseUrl);
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id', 'time_zone');
  await db.destroy();
  return { id: club.id as number, zone: club.time_zone as string };
}

/** GET an API path with the page's own session, as the page itself would. */
async function api(page: Page, path: string): Promise<unknown> {
  return page.evaluate(async (p) => {
    const res = await fetch(p, { credentials: 'same-origin' });
    if (!res.ok) throw new Error(`${p} answered ${res.status}`);
    return res.json();
  }, path);
}

/** No sideways scroll: the page is no wider than the window (390 px on a phone). */
const scrollWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

describe('club home for each role', () => {
  it("shows the coordinator's season at a glance with the API's numbers, pictures with names, links that open their pages", async () => {
    const club = await mossgate();
    for (const width of WIDTHS) {
      const w = await signInAsCoordinator(suite.browser, suite.server.url, width);
      await w.page.goto(`${suite.server.url}/clubs/${club.id}`);
      const glance = w.page.getByRole('list', { name: 'Season at a glance' });
      await glance.waitFor();
      await w.page.waitForLoadState('networkidle');
      const summary = SeasonSummarySchema.parse(await api(w.page, `/api/clubs/${club.id}/season-summary`));
      // The demo club has a season and sites (seeds/02-demo-sites.ts, 03-demo-spring-round.ts), so the plots card must be there.
      expect(summary.season).not.toBeNull();
      expect(summary.sites.length).toBeGreaterThan(0);

      for (const site of summary.sites) {
        for (const key of ['taken', 'offered', 'renewalPending', 'free'] as const) {
          expect(await w.page.getByTestId(`glance-site-${site.siteId}-${key}`).innerText(), `${site.name} ${key}`).toBe(String(site[key]));
        }
        // The picture is named with the same numbers.
        const total = site.taken + site.offered + site.renewalPending + site.free;
        const img = glance.getByRole('img', { name: `${site.name}: ${site.taken} taken, ${site.offered} offered, ${site.renewalPending} renewal pending, ${site.free} free, of ${total} plot${total === 1 ? '' : 's'}` });
        expect(await img.count(), site.name).toBe(1);
      }

      if (summary.fees.count > 0) {
        const fees = await w.page.getByTestId('glance-fees').innerText();
        expect(fees).toContain(`${formatMoney(summary.fees.paidMinor, summary.fees.currency)} collected of ${formatMoney(summary.fees.dueMinor, summary.fees.currency)} due`);
      }

      // Four weeks from this week's Monday in the club's zone.
      const monday = mondayOf(localToday(club.zone));
      expect(summary.shiftWeeks.map((wk) => wk.weekStart)).toEqual([0, 7, 14, 21].map((d) => addCalendarDays(monday, d)));
      for (const week of summary.shiftWeeks) {
        const text = await w.page.getByTestId(`glance-week-${week.weekStart}`).innerText();
        expect(text, week.weekStart).toContain(week.places === 0 ? 'No shifts' : `${week.taken} of ${week.places} places`);
      }

      if (summary.harvest.grams > 0) {
        expect(await w.page.getByTestId('glance-harvest').locator('strong').innerText()).toBe(formatWeight(summary.harvest.grams, summary.harvest.units));
      }

      for (const f of summary.findings) {
        expect(await w.page.getByTestId(`glance-finding-${f.kind}`).locator('strong').innerText(), f.kind).toBe(String(f.count));
      }

      // Every picture on the page has an accessible name (axe checks it too; this says which).
      const names = await glance.getByRole('img').evaluateAll((els) => els.map((el) => el.querySelector('title')?.textContent ?? ''));
      expect(names.length).toBeGreaterThan(0);
      expect(names.filter((n) => n.trim() === '')).toEqual([]);
      // No card says it is not there yet.
      expect(await w.page.locator('main').getByText(/coming soon/i).count()).toBe(0);

      expect(await scrollWidth(w.page), `scroll width at ${width}`).toBeLessThanOrEqual(width);
      expect({ width, violations: await axeViolations(w.page) }).toEqual({ width, violations: [] });
      await w.shot(`club-home-coordinator-${width}`);

      // A site's bar links to that site's season map.
      const first = summary.sites[0];
      await w.page.getByTestId(`glance-site-${first.siteId}`).getByRole('link', { name: first.name }).click();
      await w.page.waitForURL(`**/clubs/${club.id}/map?site=${first.siteId}`);
      await w.page.getByRole('heading', { name: `Map of ${first.name}` }).waitFor();
      expect(w.errors).toEqual([]);
      await w.page.context().close();
    }
  }, 120_000);

  it("shows a holder their plot, this week's line, the neighbour check on their plot and no coordinator pictures", async () => {
    const club = await mossgate();
    for (const width of WIDTHS) {
      const w = await signInAs(suite.browser, suite.server.url, HOLDER, width, `/clubs/${club.id}`);
      const asked: string[] = [];
      w.page.on('request', (r) => asked.push(r.url()));
      await w.page.getByRole('heading', { name: 'My plot' }).waitFor();
      const findingsLine = w.page.getByTestId('holder-findings');
      await findingsLine.waitFor();
      await w.page.waitForLoadState('networkidle');
      const mine = MyPlotSchema.parse(await api(w.page, `/api/clubs/${club.id}/my-plot`));
      expect(mine.holding).not.toBeNull();
      const book = PlotBookSchema.parse(await api(w.page, `/api/plots/${mine.holding!.plotId}/book`));
      const clashes = book.findings.filter((f) => f.severity === 'clash').length;
      const watch = book.findings.filter((f) => f.severity === 'watch').length;
      const text = await findingsLine.innerText();
      if (clashes + watch === 0) expect(text).toContain('nothing to look at');
      if (clashes > 0) expect(text).toContain(`${clashes} clash`);
      if (watch > 0) expect(text).toContain(`${watch} to watch`);
      await w.page.getByText('This week:').waitFor();

      // The coordinator's pictures are neither shown nor fetched (nor their code).
      expect(await w.page.getByRole('list', { name: 'Season at a glance' }).count()).toBe(0);
      expect(asked.filter((u) => /season-summary|season-glance/.test(u))).toEqual([]);
      expect(await w.page.locator('main').getByText(/coming soon/i).count()).toBe(0);

      expect(await scrollWidth(w.page), `scroll width at ${width}`).toBeLessThanOrEqual(width);
      expect({ width, violations: await axeViolations(w.page) }).toEqual({ width, violations: [] });
      await w.shot(`club-home-holder-${width}`);
      expect(w.errors).toEqual([]);
      await w.page.context().close();
    }
  }, 90_000);

  it("shows a volunteer this week's open shifts, their next shift and their hours, as the shifts API answers", async () => {
    const club = await mossgate();
    for (const width of WIDTHS) {
      const w = await signInAs(suite.browser, suite.server.url, VOLUNTEER, width, `/clubs/${club.id}`);
      const open = w.page.getByTestId('volunteer-open');
      await open.waitFor();
      await w.page.waitForLoadState('networkidle');
      const monday = mondayOf(localToday(club.zone));
      const week = ShiftListSchema.parse(await api(w.page, `/api/clubs/${club.id}/shifts?from=${monday}&to=${addCalendarDays(monday, 6)}&open=true`));
      const needing = week.items.filter((s) => s.state === 'needs_people');
      await expect.poll(() => open.locator('strong').first().innerText()).toBe(String(needing.length));

      const mine = MyShiftsSchema.parse(await api(w.page, `/api/clubs/${club.id}/my-shifts`));
      const next = mine.upcoming.find((s) => s.myClaim?.status === 'taken');
      const nextCard = await w.page.getByTestId('volunteer-next').innerText();
      if (next) expect(nextCard).toContain(next.title);
      else expect(nextCard).toContain('You have no place on a shift yet.');
      // README.md: Lucía holds a place on the first compost shift, so she has a next shift.
      expect(next).toBeDefined();

      const hoursCard = w.page.getByTestId('volunteer-hours');
      expect(await hoursCard.locator('strong').first().innerText()).toBe(String(mine.hours.hours));
      if (mine.hours.required) expect(await hoursCard.innerText()).toContain(`of ${mine.hours.required} hour`);

      expect(await w.page.locator('main').getByText(/coming soon/i).count()).toBe(0);
      expect(await scrollWidth(w.page), `scroll width at ${width}`).toBeLessThanOrEqual(width);
      expect({ width, violations: await axeViolations(w.page) }).toEqual({ width, violations: [] });
      await w.shot(`club-home-volunteer-${width}`);
      expect(w.errors).toEqual([]);
      await w.page.context().close();
    }
  }, 90_000);
});
