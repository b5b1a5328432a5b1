import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { openPage } from '../helpers/browser';
import { seededServerAndBrowser, signInAs, switchClub } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// From the front page: someone signed out is sent to the sign-in form.
const signIn = (width: number, email: string) => signInAs(suite.browser, suite.server.url, email, width, '/');

describe('signing in', () => {
  it('the demo coordinator sees the club home and the coordinator navigation', async () => {
    const w = await signIn(1280, 'maren@example.org');
    // Maren runs Mossgate and only volunteers at Cinder Lane (first by name): she lands where she runs the club.
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    const nav = w.page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Members' }).waitFor();
    await w.shot('sign-in-coordinator-desktop');

    await nav.getByRole('link', { name: 'Members' }).click();
    await w.page.getByRole('cell', { name: 'Teodor Lind', exact: true }).waitFor();
    await w.shot('members-desktop');
    expect(w.errors).toEqual([]);
  });

  it('after switching clubs, the next sign-in from another browser opens the club last used', async () => {
    const first = await signIn(1280, 'maren@example.org');
    await first.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await switchClub(first.page, 'Cinder Lane Growers');
    // The server has it (not this browser's storage): wait until the session says so.
    const cinder = (await db('clubs').where({ name: 'Cinder Lane Growers' }).first('id')).id;
    const startClub = () => first.page.evaluate(() => fetch('/api/session').then((r) => r.json()).then((b) => b.user.startClubId));
    await expect.poll(startClub).toBe(cinder);

    const again = await signIn(390, 'maren@example.org');
    await again.page.getByRole('heading', { name: 'Cinder Lane Growers' }).waitFor();
    // Put her back in Mossgate for the other tests of this seeded server.
    await switchClub(again.page);
    expect([...first.errors, ...again.errors]).toEqual([]);
  }, 60_000);

  it('a plot holder on a phone sees their own navigation and no coordinator pages', async () => {
    const w = await signIn(390, 'teodor@example.org');
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    const menu = w.page.getByRole('button', { name: /menu/i });
    if (await menu.isVisible()) await menu.click();
    const nav = w.page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'My plot' }).waitFor();
    expect(await nav.getByRole('link', { name: 'Members' }).count()).toBe(0);
    await w.shot('sign-in-plot-holder-phone');
    expect(w.errors).toEqual([]);
  });

  it('a wrong password shows a message on the form', async () => {
    const w = await openPage(suite.browser, 390);
    await w.page.goto(`${suite.server.url}/sign-in`);
    await w.page.getByLabel('E-mail').fill('maren@example.org');
    await w.page.getByLabel('Password').fill('not-the-password');
    await w.page.getByRole('button', { name: 'Sign in' }).click();
    await w.page.getByText('E-mail or password is wrong.').waitFor();
    await w.shot('sign-in-wrong-password-phone');
    // The browser logs the 401 response itself; nothing else may be logged.
    expect(w.errors.filter((e) => !e.includes('401'))).toEqual([]);
  });
});
