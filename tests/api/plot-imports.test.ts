import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { plotCsvColumns, type Plot } from '@shared/schemas/plots';
import type { Role } from '@shared/schemas/auth';
import { buildClub } from '../factories';
import { addSite as addSiteWithDefaults, signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const HEADER = plotCsvColumns.join(',');
const signedIn = (clubId: number, roles: Role[]) => signedInMember(t, clubId, roles);
// The sites here also set a path width (0.9 m), as the plot tests expect.
const addSite = (c: Agent, clubId: number, name: string) => addSiteWithDefaults(c, clubId, name, { pathWidth: 0.9 });

/** A club, its coordinator signed in, and a 40 m × 30 m site made through the API. */
async function coordinatorWithSite(name = 'North field') {
  const club = await buildClub(t.db);
  const c = await signedIn(club.id, ['coordinator']);
  const site = await addSite(c, club.id, name);
  return { club, c, site };
}

async function addPlot(c: Agent, siteId: number, body: Record<string, unknown>) {
  const res = await c.post(`/api/sites/${siteId}/plots`, body);
  expect(res.status).toBe(201);
  return res.body as Plot;
}

const plotCount = async (siteId: number) =>
  Number((await t.db('plots').where({ site_id: siteId }).whereNull('deleted_at').count({ n: '*' }))[0].n);

const importCsv = (c: Agent, siteId: number, csv: string, opts: { units?: 'metric' | 'us'; commit?: boolean } = {}) =>
  c.post(`/api/sites/${siteId}/plot-imports`, { csv, units: opts.units ?? 'metric', commit: opts.commit ?? false });

/** What a plot is, without what the server assigns. */
const essence = ({ id: _id, siteId: _s, version: _v, updatedAt: _u, ...rest }: Plot) => rest;

describe('plot CSV import: preview', () => {
  it('reports each bad row by line number and column, previews the good ones in metres, and saves nothing', async () => {
    const { c, site } = await coordinatorWithSite();
    const csv = [
      'Label, X ,Y,Width,LENGTH,Soil depth,water-tap,Kind',
      'A-1,0,0,3,6,0.3,yes,Raised bed',
      'A-2,4,0,0,6,,,',
      'A-3,8,0,abc,6,,maybe,greenhouse',
      'A-4,12,0,3,6,,no,shared-bed',
    ].join('\n');
    const res = await importCsv(c, site.id, csv);
    expect(res.status).toBe(200);
    expect(res.body.committed).toBe(false);
    expect(res.body.created).toBe(0);
    expect(res.body.errors).toEqual([
      { row: 3, field: 'width', message: 'Must be more than 0' },
      { row: 4, field: 'width', message: 'Enter a number, like 2.5 (with a dot for decimals)' },
      { row: 4, field: 'kind', message: 'Use one of: in_ground, raised_bed, container, shared_bed' },
      { row: 4, field: 'water_tap', message: 'Use yes or no' },
    ]);
    expect(res.body.rows.map((r: { row: number; label: string }) => [r.row, r.label])).toEqual([
      [2, 'A-1'],
      [3, 'A-2'],
      [4, 'A-3'],
      [5, 'A-4'],
    ]);
    expect(res.body.rows[0].plot).toEqual({
      label: 'A-1',
      x: 0,
      y: 0,
      width: 3,
      length: 6,
      rotation: 0,
      kind: 'raised_bed',
      soilDepth: 0.3,
      soilPh: null,
      soilTestedOn: null,
      sun: 'full',
      isAccessible: false,
      hasWaterTap: true,
      notes: '',
    });
    expect(res.body.rows[1].plot).toBeNull();
    expect(res.body.rows[3].plot).toMatchObject({ kind: 'shared_bed', hasWaterTap: false });
    expect(await plotCount(site.id)).toBe(0);
  });

  it('counts blank lines and cells spanning lines when numbering rows, so the number is the line in the file', async () => {
    const { c, site } = await coordinatorWithSite();
    const csv = `${HEADER}\r\nA-1,0,0,3,6\r\n\r\nA-2,4,0,3,6,,,,,,,,,"Two\r\nlines"\r\n,,,,\r\nA-3,8,0,3,-6\r\n`;
    const res = await importCsv(c, site.id, csv);
    expect(res.body.rows.map((r: { row: number }) => r.row)).toEqual([2, 4, 7]);
    expect(res.body.rows[1].plot.notes).toBe('Two\r\nlines');
    expect(res.body.errors).toEqual([{ row: 7, field: 'length', message: 'Cannot be negative' }]);
  });

  it('reads semicolon-separated files, as spreadsheets set to a comma decimal write them', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await importCsv(c, site.id, 'label;x;y;width;length;notes\nA-1;0;0;3;6;"Tap, hose"\n');
    expect(res.body.errors).toEqual([]);
    expect(res.body.rows[0].plot).toMatchObject({ label: 'A-1', width: 3, length: 6, notes: 'Tap, hose' });
  });

  it('reports unknown and missing columns as problems with the file (row 1)', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await importCsv(c, site.id, 'label,x,y,width,colour\nA-1,0,0,3,red\n');
    expect(res.status).toBe(200);
    expect(res.body.errors).toEqual([
      { row: 1, field: 'colour', message: `Unknown column "colour"; the columns are ${plotCsvColumns.join(', ')}` },
      { row: 1, field: 'length', message: 'The required column "length" is missing' },
    ]);
    expect(res.body.rows).toEqual([{ row: 2, label: 'A-1', plot: null }]);
  });

  it('reports labels used twice in the file or already on the site, plots off the site, and overlaps naming both plots', async () => {
    const { c, site } = await coordinatorWithSite();
    await addPlot(c, site.id, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 });
    const csv = [
      HEADER,
      'a-1,10,0,3,6', // label taken on the site (labels ignore case)
      'B-1,1,1,1,1', // inside A-1
      'C-1,20,0,3,6',
      'c-1,21,0,3,6', // same label as row 4, and on top of it
      'D-1,38,0,3,6', // runs 1 m past the east edge (40 m)
      'E-1,30,27,3,6,90', // turned a quarter: 6 m east-west, 3 m north-south, so it just fits
      'F-1,3,0,3,6', // touches A-1 along its east edge: allowed
    ].join('\n');
    const res = await importCsv(c, site.id, csv);
    expect(res.body.errors).toEqual([
      { row: 2, field: 'label', message: 'Plot A-1 already exists on this site' },
      { row: 3, field: 'x', message: 'Plot B-1 overlaps plot A-1, already on the site; plots may touch but not overlap' },
      { row: 5, field: 'label', message: 'The label c-1 is also used on row 4' },
      { row: 5, field: 'x', message: 'Plot c-1 overlaps plot C-1 on row 4; plots may touch but not overlap' },
      { row: 6, field: 'x', message: 'Plot D-1 reaches 41 m east, past the edge of the site (40 m wide)' },
    ]);
    expect(await plotCount(site.id)).toBe(1);
  });

  it('answers 2,000 rows piled on one spot with the first 100 problems and a count of the rest, and saves nothing', async () => {
    const { c, site } = await coordinatorWithSite();
    const lines = Array.from({ length: 2000 }, (_, i) => `P${i},1,1,3,6`);
    const res = await importCsv(c, site.id, [HEADER, ...lines].join('\n'));
    expect(res.status).toBe(200);
    // Computed: rows 3–2001 (1,999 rows) each overlap P0 on row 2; 100 are listed, 1,899 counted.
    expect(res.body.errors).toHaveLength(101);
    expect(res.body.errors[0]).toEqual({ row: 3, field: 'x', message: 'Plot P1 overlaps plot P0 on row 2; plots may touch but not overlap' });
    expect(res.body.errors[99]).toEqual({
      row: 102,
      field: 'x',
      message: 'Plot P100 overlaps plot P0 on row 2 and at least 9 more above it; plots may touch but not overlap',
    });
    expect(res.body.errors[100]).toEqual({
      row: 0,
      field: '',
      message: '…and 1899 more problems on 1899 rows not listed here. Fix these first, then check again.',
    });
    // The 2,000 preview rows (about 240 bytes each) are most of it; it was 226 MB with every pair listed.
    expect(res.text.length).toBeLessThan(1_000_000);
    const refused = await importCsv(c, site.id, [HEADER, ...lines].join('\n'), { commit: true });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toHaveLength(101);
    expect(refused.body.error.message).toBe('100 rows have problems; nothing was imported.');
    expect(await plotCount(site.id)).toBe(0);
  });

  it('refuses a file with more than 2000 plot rows', async () => {
    const { c, site } = await coordinatorWithSite();
    const lines = Array.from({ length: 2001 }, (_, i) => `P${i},0,0,1,1`);
    const res = await importCsv(c, site.id, [HEADER, ...lines].join('\n'));
    expect(res.body.errors).toEqual([
      { row: 1, field: '', message: 'The file has 2001 plot rows; import at most 2000 at a time' },
    ]);
    expect(res.body.rows).toEqual([]);
  });
});

describe('plot CSV import: commit', () => {
  it('imports nothing when one row among good ones is bad, and names the row in the error', async () => {
    const { c, site } = await coordinatorWithSite();
    await addPlot(c, site.id, { label: 'Old', x: 30, y: 20, width: 3, length: 6 });
    const before = await plotCount(site.id);
    const csv = [HEADER, 'A-1,0,0,3,6', 'A-2,4,0,3,6', 'A-3,8,0,3,6,45', 'A-4,12,0,3,6'].join('\n');
    const res = await importCsv(c, site.id, csv, { commit: true });
    expect(res.status).toBe(400);
    expect(res.body).toEqual({
      error: {
        code: 'validation_failed',
        message: '1 row has problems; nothing was imported.',
        fields: { 'row 4.rotation': 'Rotation is 0 or 90' },
      },
    });
    expect(await plotCount(site.id)).toBe(before);
    expect(await t.db('plot_events').where({ kind: 'imported' }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('imports a clean US file of 10 plots in one go, in metres, each with an "imported" history line', async () => {
    const { c, site } = await coordinatorWithSite();
    const rows = Array.from({ length: 10 }, (_, i) => {
      const col = i % 5;
      const line = Math.floor(i / 5);
      return `R${line + 1}-${col + 1},${col * 10},${line * 20},10,20,0,raised bed,12,6.5,2026-04-12,Part shade,yes,no,Bed ${i + 1}`;
    });
    const res = await importCsv(c, site.id, [HEADER, ...rows].join('\n'), { units: 'us', commit: true });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ committed: true, created: 10, errors: [] });

    const list = (await c.get(`/api/sites/${site.id}/plots`).expect(200)).body.items as Plot[];
    expect(list).toHaveLength(10);
    const r2c4 = list.find((p) => p.label === 'R2-4')!;
    // 1 ft = 0.3048 m exactly (NIST SP 811, 2008, Appendix B.8), so 30 ft = 9.144 m, 20 ft = 6.096 m, 10 ft = 3.048 m.
    expect(r2c4).toMatchObject({ x: 9.144, y: 6.096, width: 3.048, length: 6.096, rotation: 0 });
    // 1 in = 0.0254 m exactly (NIST SP 811, Appendix B.8): 12 in = 0.3048 m, kept to the centimetre as 0.30 m.
    expect(r2c4).toMatchObject({ soilDepth: 0.3, soilPh: 6.5, soilTestedOn: '2026-04-12', kind: 'raised_bed', sun: 'part' });
    expect(r2c4).toMatchObject({ isAccessible: true, hasWaterTap: false, notes: 'Bed 9' });

    const events = await t.db('plot_events').orderBy('id').select('plot_id', 'kind', 'details');
    expect(events).toHaveLength(10);
    expect(events.every((e) => e.kind === 'imported')).toBe(true);
    expect(events.map((e) => e.details.label).sort()).toEqual(list.map((p) => p.label).sort());
    const detail = (await c.get(`/api/plots/${r2c4.id}`).expect(200)).body;
    expect(detail.history[0]).toMatchObject({ kind: 'imported', summary: 'Imported from a CSV file as R2-4' });
  });

  it('refuses the whole file at commit when it overlaps a plot already on the site', async () => {
    const { c, site } = await coordinatorWithSite();
    await addPlot(c, site.id, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 });
    const res = await importCsv(c, site.id, [HEADER, 'B-1,10,0,3,6', 'B-2,2.5,5.5,3,6'].join('\n'), { commit: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      'row 3.x': 'Plot B-2 overlaps plot A-1, already on the site; plots may touch but not overlap',
    });
    expect(await plotCount(site.id)).toBe(1);
  });

  it('checks the body: units and commit are required, unknown fields refused', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await c.post(`/api/sites/${site.id}/plot-imports`, { csv: HEADER, units: 'imperial', extra: 1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['commit', 'extra', 'units']);
  });
});

describe('plot CSV export', () => {
  const samples = [
    { label: 'A-1', x: 0, y: 0, width: 3, length: 6 },
    {
      label: 'B-2',
      x: 3.5,
      y: 0.25,
      width: 1.2,
      length: 2.4,
      rotation: 90,
      kind: 'raised_bed',
      soilDepth: 0.45,
      soilPh: 6.8,
      soilTestedOn: '2026-03-01',
      sun: 'part',
      isAccessible: true,
      hasWaterTap: true,
      notes: 'Near the shed, "blue" gate\nSecond line',
    },
    { label: 'C 3', x: 10.001, y: 20.333, width: 0.914, length: 1.829, kind: 'container', sun: 'shade', notes: '=1+1 is not a formula' },
  ];

  it('downloads every live plot as CSV with a file name from the site, readable by any member', async () => {
    const { club, c, site } = await coordinatorWithSite('North field');
    for (const s of samples) await addPlot(c, site.id, s);
    const holder = await signedIn(club.id, ['plot_holder']);
    const res = await holder.get(`/api/sites/${site.id}/plots.csv?units=metric`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="North field-plots.csv"');
    const lines = res.text.replace(/^\uFEFF/, '').split('\r\n');
    expect(lines[0]).toBe(HEADER);
    expect(lines[1]).toBe('A-1,0,0,3,6,0,in_ground,,,,full,no,no,');
    // A leading quote keeps a spreadsheet from running the note as a formula (OWASP, "CSV Injection").
    expect(res.text).toContain(`"'=1+1 is not a formula"`);
  });

  for (const units of ['metric', 'us'] as const) {
    it(`gives back the same plots when a ${units} export is imported into an empty site`, async () => {
      const { club, c, site } = await coordinatorWithSite('North field');
      for (const s of samples) await addPlot(c, site.id, s);
      const exported = await c.get(`/api/sites/${site.id}/plots.csv?units=${units}`).expect(200);
      const second = await addSite(c, club.id, 'South field');

      const res = await importCsv(c, second.id, exported.text, { units, commit: true });
      expect(res.status).toBe(201);
      expect(res.body.created).toBe(samples.length);

      const original = (await c.get(`/api/sites/${site.id}/plots`)).body.items.map(essence);
      const copy = (await c.get(`/api/sites/${second.id}/plots`)).body.items.map(essence);
      expect(copy).toEqual(original);
      expect(copy.find((p: Plot) => p.label === 'C 3')).toMatchObject({ x: 10.001, y: 20.333, notes: '=1+1 is not a formula' });
    });
  }

  it('offers a template whose example rows import cleanly', async () => {
    const { c, site } = await coordinatorWithSite();
    for (const units of ['metric', 'us'] as const) {
      const res = await c.get(`/api/sites/${site.id}/plot-imports/template.csv?units=${units}`);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
      expect(res.headers['content-disposition']).toMatch(/^attachment; filename=".*\.csv"$/);
      const lines = res.text.replace(/^\uFEFF/, '').trim().split('\r\n');
      expect(lines[0]).toBe(HEADER);
      expect(lines).toHaveLength(3);
      const preview = await importCsv(c, site.id, res.text, { units });
      expect(preview.body.errors).toEqual([]);
      expect(preview.body.rows.map((r: { plot: unknown }) => r.plot !== null)).toEqual([true, true]);
    }
    const us = (await importCsv(c, site.id, (await c.get(`/api/sites/${site.id}/plot-imports/template.csv?units=us`)).text, { units: 'us' })).body;
    // 10 ft × 20 ft at 0.3048 m per foot (NIST SP 811, Appendix B.8).
    expect(us.rows[0].plot).toMatchObject({ width: 3.048, length: 6.096 });
  });
});

describe('plot CSV access', () => {
  it('lets only coordinators of the site’s club import: a plot holder gets 403, another club’s coordinator 404', async () => {
    const { club, site } = await coordinatorWithSite();
    const holder = await signedIn(club.id, ['plot_holder']);
    const csv = [HEADER, 'A-1,0,0,3,6'].join('\n');
    const asHolder = await importCsv(holder, site.id, csv, { commit: true });
    expect(asHolder.status).toBe(403);
    expect(asHolder.body.error.code).toBe('forbidden');
    expect((await holder.get(`/api/sites/${site.id}/plot-imports/template.csv`)).status).toBe(403);

    const otherClub = await buildClub(t.db);
    const outsider = await signedIn(otherClub.id, ['coordinator']);
    const asOutsider = await importCsv(outsider, site.id, csv, { commit: true });
    expect(asOutsider.status).toBe(404);
    expect(asOutsider.body.error).toEqual({ code: 'not_found', message: 'The site was not found.' });
    expect((await outsider.get(`/api/sites/${site.id}/plots.csv`)).status).toBe(404);
    expect(await plotCount(site.id)).toBe(0);
  });

  it('asks for sign-in and for the CSRF token', async () => {
    const { c, site } = await coordinatorWithSite();
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.get(`/api/sites/${site.id}/plots.csv`)).status).toBe(401);
    const noToken = await c.agent.post(`/api/sites/${site.id}/plot-imports`).send({ csv: HEADER, units: 'metric', commit: false });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe('csrf_failed');
  });
});
