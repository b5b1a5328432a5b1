import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { setupTestApp, truncateAll } from '../helpers/app';
import { addSite, signedInMember } from '../helpers/api';

const root = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-archive-'));
const uploadDir = path.join(root, 'uploads');
const storedDir = path.join(uploadDir, 'site-backgrounds');
const t = setupTestApp({ UPLOAD_DIR: uploadDir });
afterAll(async () => {
  await t.close();
  fs.rmSync(root, { recursive: true, force: true });
});
beforeEach(async () => {
  await truncateAll(t.db);
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

const versionOf = async (siteId: number) => (await t.db('sites').where({ id: siteId }).first('version')).version as number;

/** A plot on the site held last season, with a fee and a payment against it. */
async function plotWithRecords(clubId: number, siteId: number) {
  const holder = await buildMember(t.db, { clubId, roles: ['plot_holder'], user: { name: 'Rowan Holder' } });
  const [plot] = await t.db('plots').insert({ site_id: siteId, label: 'B-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: clubId, year: 2026 }).returning('id');
  const [alloc] = await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.id, source: 'manual' }).returning('id');
  const [fee] = await t.db('fees')
    .insert({ club_id: clubId, season_id: season.id, allocation_id: alloc.id, user_id: holder.id, plot_id: plot.id, description: 'Plot B-1, 2026 season', plot_fee_minor: 3000, deposit_minor: 0, currency: 'GBP', due_on: '2026-04-01' })
    .returning('id');
  await t.db('payments').insert({ fee_id: fee.id, amount_minor: 1000, method: 'cash', paid_on: '2026-03-01' });
  return { plotId: plot.id as number, feeId: fee.id as number };
}

describe('deleting and archiving a site', () => {
  it('refuses to delete a site whose plots have allocations, fees or payments, and offers archiving', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const site = await addSite(c, club.id, 'Orchard strip');
    const { feeId } = await plotWithRecords(club.id, site.id);

    const res = await c.delete(`/api/sites/${site.id}?version=${await versionOf(site.id)}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.message).toMatch(/cannot be deleted\. Archive it instead/);
    expect(await t.db('sites').where({ id: site.id }).first('id')).toBeTruthy();
    expect(await t.db('payments').where({ fee_id: feeId }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('archives a site with the current version only; it leaves lists and the map, and its fees stay reachable', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const site = await addSite(c, club.id, 'Orchard strip');
    await addSite(c, club.id, 'Brook end');
    const { feeId } = await plotWithRecords(club.id, site.id);
    const version = await versionOf(site.id);

    expect((await c.post(`/api/sites/${site.id}/archive`, { version: version + 5 })).status).toBe(409);
    expect((await c.post(`/api/sites/${site.id}/archive`, {})).status).toBe(400);
    await c.post(`/api/sites/${site.id}/archive`, { version }).expect(204);

    const list = (await c.get(`/api/clubs/${club.id}/sites`)).body.items.map((s: { name: string }) => s.name);
    expect(list).toEqual(['Brook end']);
    expect((await c.get(`/api/sites/${site.id}`)).status).toBe(404);
    expect((await c.get(`/api/sites/${site.id}/plots`)).status).toBe(404);
    const fees = (await c.get(`/api/clubs/${club.id}/fees?status=all`)).body.items;
    expect(fees.map((f: { id: number; siteName: string; paidMinor: number }) => [f.id, f.siteName, f.paidMinor])).toEqual([[feeId, 'Orchard strip', 1000]]);
    expect(await t.db('sites').where({ id: site.id }).whereNotNull('archived_at').first('id')).toBeTruthy();
  });

  it('deletes a site without records for good, checks the version and removes its background file', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const site = await addSite(c, club.id, 'Spare corner');
    await t.db('plots').insert({ site_id: site.id, label: 'C-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 });
    fs.mkdirSync(storedDir, { recursive: true });
    const name = `${'ab'.repeat(16)}.png`;
    fs.writeFileSync(path.join(storedDir, name), 'not really an image');
    await t.db('sites').where({ id: site.id }).update({ background_file: name, background_mime: 'image/png', background_width_px: 10, background_height_px: 10 });
    const version = await versionOf(site.id);

    expect((await c.delete(`/api/sites/${site.id}?version=${version - 1 || 99}`)).status).toBe(409);
    expect((await c.delete(`/api/sites/${site.id}`)).status).toBe(400);
    await c.delete(`/api/sites/${site.id}?version=${version}`).expect(204);
    expect(await t.db('sites').where({ id: site.id }).first('id')).toBeUndefined();
    expect(await t.db('plots').where({ site_id: site.id }).first('id')).toBeUndefined();
    expect(fs.readdirSync(storedDir)).toEqual([]);
  });

  it('a plot holder may neither delete nor archive a site', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    const site = await addSite(c, club.id, 'Orchard strip');
    const version = await versionOf(site.id);
    expect((await holder.delete(`/api/sites/${site.id}?version=${version}`)).status).toBe(403);
    expect((await holder.post(`/api/sites/${site.id}/archive`, { version })).status).toBe(403);
  });

  it('takes the club’s time zone from its first site', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    await addSite(c, club.id, 'Harbour beds', { timeZone: 'Pacific/Auckland' });
    await addSite(c, club.id, 'Hill beds', { timeZone: 'Europe/London' });
    expect((await t.db('clubs').where({ id: club.id }).first('time_zone')).time_zone).toBe('Pacific/Auckland');
  });
});
