import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { weatherCsvColumns, type WeatherImportResult } from '@shared/schemas/weather';
import { buildClub } from '../factories';
import { addSite, signedInMember, type Agent } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const HEADER = weatherCsvColumns.join(',');

async function coordinatorWithSite(more: Record<string, unknown> = {}) {
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const site = await addSite(c, club.id, 'North field', more);
  return { club, c, site };
}

const importCsv = (c: Agent, siteId: number, csv: string, opts: { units?: 'metric' | 'us'; duplicates?: 'skip' | 'replace'; commit?: boolean } = {}) =>
  c.post(`/api/sites/${siteId}/weather-imports`, {
    csv,
    units: opts.units ?? 'metric',
    duplicates: opts.duplicates ?? 'skip',
    commit: opts.commit ?? false,
  });

const rows = (siteId: number) =>
  t.db('weather_days').where({ site_id: siteId }).orderBy('day').select('day', 't_min_c', 't_max_c', 'rain_mm', 'wind_ms', 'wind_height_m', 'source');
const dayCount = async (siteId: number) => Number((await t.db('weather_days').where({ site_id: siteId }).count({ n: '*' }))[0].n);

describe('weather CSV import: checking', () => {
  it('names the line and the column of each problem, imports nothing when one line is bad, and says why', async () => {
    const { c, site } = await coordinatorWithSite();
    const csv = [
      'Date, T min ,T-MAX,Rain',
      '2026-06-01,9,18,2.5',
      '2026-06-02,10,19,0',
      '2026-06-03,11,20,lots',
      '2026-06-04,12,8,',
      '2026-06-31,,,1',
      '1999-12-31,,,1',
      '2026-06-07,,,',
    ].join('\n');
    const res = await importCsv(c, site.id, csv);
    expect(res.status).toBe(200);
    const result = res.body as WeatherImportResult;
    expect(result.errors).toEqual([
      { row: 4, field: 'rain', message: 'Enter a number, like 2.5 (with a dot for decimals)' },
      { row: 5, field: 't_min', message: 'The lowest temperature is above the highest' },
      { row: 6, field: 'date', message: 'Use a date like 2026-06-03' },
      { row: 7, field: 'date', message: 'On or after 2000-01-01' },
      { row: 8, field: '', message: 'The row has a date but no values' },
    ]);
    expect(result.rows.map((r) => [r.row, r.day, r.status])).toEqual([
      [2, '2026-06-01', 'new'],
      [3, '2026-06-02', 'new'],
      [4, '2026-06-03', null],
      [5, '2026-06-04', null],
      [6, '2026-06-31', null],
      [7, '1999-12-31', null],
      [8, '2026-06-07', null],
    ]);
    expect(result.rows[0].values).toMatchObject({ tMinC: 9, tMaxC: 18, rainMm: 2.5, windMs: null });
    expect(result.committed).toBe(false);
    expect(await dayCount(site.id)).toBe(0);

    const refused = await importCsv(c, site.id, csv, { commit: true });
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toBe('5 rows have problems; nothing was imported.');
    expect(refused.body.error.fields['row 4.rain']).toBe('Enter a number, like 2.5 (with a dot for decimals)');
    expect(refused.body.error.fields['row 8']).toBe('The row has a date but no values');
    expect(await dayCount(site.id)).toBe(0);
  });

  it('commits nothing when only the last of many good lines is bad', async () => {
    const { c, site } = await coordinatorWithSite();
    const good = Array.from({ length: 30 }, (_, i) => `${addCalendarDays('2026-05-01', i)},8,16,${i % 4}`);
    const res = await importCsv(c, site.id, [HEADER, ...good, '2026-06-15,8,16,-2'].join('\n'), { commit: true });
    expect(res.status).toBe(400);
    // computed: header on line 1, 30 good lines on 2–31, the bad one on line 32
    expect(res.body.error.fields).toEqual({ 'row 32.rain': 'At least 0 mm' });
    expect(await dayCount(site.id)).toBe(0);
  });

  it('refuses a day after today at the site, a missing date column, unknown columns and more than 2000 rows', async () => {
    const { c, site } = await coordinatorWithSite();
    const tomorrow = addCalendarDays(localToday('Europe/London'), 1);
    const future = await importCsv(c, site.id, `date,rain\n${tomorrow},3\n`);
    expect(future.body.errors).toEqual([{ row: 2, field: 'date', message: `After today at North field (${localToday('Europe/London')})` }]);

    const header = await importCsv(c, site.id, 'rain,snow\n3,1\n');
    expect(header.body.errors).toEqual([
      { row: 1, field: 'snow', message: `Unknown column "snow"; the columns are ${weatherCsvColumns.join(', ')}` },
      { row: 1, field: 'date', message: 'The required column "date" is missing' },
    ]);

    const lines = Array.from({ length: 2001 }, (_, i) => `${addCalendarDays('2020-01-01', i)},1`);
    const many = await importCsv(c, site.id, ['date,rain', ...lines].join('\n'));
    expect(many.body.errors).toEqual([{ row: 1, field: '', message: 'The file has 2001 day rows; import at most 2000 at a time' }]);
    // computed: 2,000 rows is the limit and goes through
    const limit = await importCsv(c, site.id, ['date,rain', ...lines.slice(0, 2000)].join('\n'), { commit: true });
    expect(limit.status).toBe(201);
    expect(limit.body.counts).toEqual({ new: 2000, replaced: 0, skipped: 0 });
    expect(await dayCount(site.id)).toBe(2000);
  });

  it('refuses a file holding a NUL or another control character as a whole, naming the line', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await importCsv(c, site.id, 'date,rain\n2026-06-01,1\n2026-06-02,2\u0000\n', { commit: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.csv).toBe('Line 3 holds a NUL character; save the file again as plain CSV text (UTF-8) and import it once more');
    const bell = await importCsv(c, site.id, 'date,rain\n2026-06-01,1\u0007\n');
    expect(bell.status).toBe(400);
    expect(bell.body.error.fields.csv).toMatch(/^Line 2 holds a control character \(U\+0007\)/);
    expect(await dayCount(site.id)).toBe(0);
  });

  it('names both lines when a day appears twice in the file', async () => {
    const { c, site } = await coordinatorWithSite();
    const res = await importCsv(c, site.id, ['date,rain', '2026-06-01,1', '2026-06-02,2', '2026-06-01,3'].join('\n'), { commit: false });
    expect(res.body.errors).toEqual([{ row: 4, field: 'date', message: 'The day 2026-06-01 is on lines 2 and 4; keep one of them' }]);
    const refused = await importCsv(c, site.id, ['date,rain', '2026-06-01,1', '2026-06-02,2', '2026-06-01,3'].join('\n'), { commit: true });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toEqual({ 'row 4.date': 'The day 2026-06-01 is on lines 2 and 4; keep one of them' });
    expect(await dayCount(site.id)).toBe(0);
  });
});

describe('weather CSV import: units', () => {
  it('converts a US file to SI exactly: 1.00 in = 25.4 mm, 50 °F = 10 °C, 10 mph and 6.5 ft to metres', async () => {
    const { c, site } = await coordinatorWithSite({ units: 'us', timeZone: 'America/Denver' });
    // NIST Handbook 44, Appendix C: 1 in = 2.54 cm, 1 ft = 0.3048 m, 1 mi = 1.609344 km, all exact
    // (1 mph = 0.44704 m/s); NIST SP 811 (2008), Appendix B.9: t/°C = (t/°F − 32)/1.8.
    const csv = [HEADER, '2026-06-01,50,86,1.00,40,95,70,10,6.5,12,25.5', '2026-06-02,32,140,0.01,,,,,,,'].join('\n');
    const preview = await importCsv(c, site.id, csv, { units: 'us' });
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.rows[0].values).toEqual({
      tMinC: 10,
      tMaxC: 30, // computed: (86 − 32)/1.8 = 30
      rainMm: 25.4,
      rhMinPct: 40,
      rhMaxPct: 95,
      rhMeanPct: 70,
      windMs: 4.47, // computed: 10 × 0.44704 = 4.4704, kept to 0.001 m/s
      windHeightM: 1.981, // computed: 6.5 × 0.3048 = 1.9812, kept to the millimetre
      sunshineH: 12,
      solarMjM2: 25.5, // MJ/m² in both unit systems
    });
    const res = await importCsv(c, site.id, csv, { units: 'us', commit: true });
    expect(res.status).toBe(201);
    expect(res.body.changedDays).toEqual(['2026-06-01', '2026-06-02']);
    expect(await rows(site.id)).toEqual([
      { day: '2026-06-01', t_min_c: 10, t_max_c: 30, rain_mm: 25.4, wind_ms: 4.47, wind_height_m: 1.981, source: 'import' },
      // computed: 32 °F = 0 °C, 140 °F = (140 − 32)/1.8 = 60 °C (the highest the log takes), 0.01 in × 25.4 = 0.254 mm
      { day: '2026-06-02', t_min_c: 0, t_max_c: 60, rain_mm: 0.254, wind_ms: null, wind_height_m: null, source: 'import' },
    ]);
  });

  it('states range problems in the file’s own units', async () => {
    const { c, site } = await coordinatorWithSite();
    const us = await importCsv(c, site.id, 'date,t_max,rain,wind_height\n2026-06-01,141,40,1\n', { units: 'us' });
    expect(us.body.errors).toEqual([
      // computed: 60 °C × 1.8 + 32 = 140 °F; 1000 mm / 25.4 = 39.37 in; 0.5 m / 0.3048 = 1.64 ft
      { row: 2, field: 't_max', message: 'At most 140 °F' },
      { row: 2, field: 'rain', message: 'At most 39.37 in' },
      { row: 2, field: 'wind_height', message: 'At least 1.64 ft' },
    ]);
    // The same numbers are fine in a metric file, except the 141 °C.
    const metric = await importCsv(c, site.id, 'date,t_max,rain,wind_height\n2026-06-01,141,40,1\n', { units: 'metric' });
    expect(metric.body.errors).toEqual([{ row: 2, field: 't_max', message: 'At most 60 °C' }]);
  });

  it('exports the log in the template’s columns, in US units when asked, and the export imports back unchanged', async () => {
    const { c, site } = await coordinatorWithSite();
    const csv = [HEADER, '2026-06-01,10.56,21.3,0.254,41,93,68.5,2.235,2,7.25,19.8', '2026-06-02,,,12,,,,,,,'].join('\n');
    await importCsv(c, site.id, csv, { commit: true }).expect(201);
    const before = await t.db('weather_days').where({ site_id: site.id }).orderBy('day');

    const metric = await c.get(`/api/sites/${site.id}/weather.csv`).expect(200);
    expect(metric.headers['content-type']).toBe('text/csv; charset=utf-8');
    const lines = metric.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines).toEqual([HEADER, '2026-06-01,10.56,21.3,0.254,41,93,68.5,2.235,2,7.25,19.8', '2026-06-02,,,12,,,,,,,']);

    const us = await c.get(`/api/sites/${site.id}/weather.csv?units=us`).expect(200);
    const usLines = us.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    // computed: 10.56 × 1.8 + 32 = 51.008 °F; 0.254 mm / 25.4 = 0.01 in; 2 m / 0.3048 = 6.5617 ft
    expect(usLines[1].split(',').slice(0, 4)).toEqual(['2026-06-01', '51.008', '70.34', '0.01']);
    expect(usLines[1].split(',')[8]).toBe('6.5617');

    // Replacing every day with the US export leaves every stored value as it was.
    const back = await importCsv(c, site.id, us.text, { units: 'us', duplicates: 'replace', commit: true });
    expect(back.status).toBe(201);
    expect(back.body.counts).toEqual({ new: 0, replaced: 2, skipped: 0 });
    const after = await t.db('weather_days').where({ site_id: site.id }).orderBy('day');
    const values = (r: Record<string, unknown>) => {
      const { id: _i, created_at: _c, updated_at: _u, ...rest } = r;
      return rest;
    };
    expect(after.map(values)).toEqual(before.map(values));
  });
});

describe('weather CSV import: days already in the log', () => {
  async function withStoredDays() {
    const x = await coordinatorWithSite();
    await x.c.put(`/api/sites/${x.site.id}/weather/2026-06-01`, { tMinC: 7, tMaxC: 15, rainMm: 4 }).expect(201);
    await x.c.put(`/api/sites/${x.site.id}/weather/2026-06-02`, { rainMm: 9, source: 'gauge' }).expect(201);
    return x;
  }
  const file = [HEADER, '2026-06-01,8,16,,,,,,,,', '2026-06-02,,,10,,,,,,,', '2026-06-03,9,17,1,,,,,,,'].join('\n');

  it('keeps what is stored when the choice is skip, and counts new and skipped days in the preview', async () => {
    const { c, site } = await withStoredDays();
    const preview = await importCsv(c, site.id, file, { duplicates: 'skip' });
    expect(preview.body.counts).toEqual({ new: 1, replaced: 0, skipped: 2 });
    expect(preview.body.rows.map((r: { day: string; status: string }) => [r.day, r.status])).toEqual([
      ['2026-06-01', 'skip'],
      ['2026-06-02', 'skip'],
      ['2026-06-03', 'new'],
    ]);
    const res = await importCsv(c, site.id, file, { duplicates: 'skip', commit: true });
    expect(res.status).toBe(201);
    expect(res.body.changedDays).toEqual(['2026-06-03']);
    expect(await rows(site.id)).toEqual([
      { day: '2026-06-01', t_min_c: 7, t_max_c: 15, rain_mm: 4, wind_ms: null, wind_height_m: null, source: 'form' },
      { day: '2026-06-02', t_min_c: null, t_max_c: null, rain_mm: 9, wind_ms: null, wind_height_m: null, source: 'gauge' },
      { day: '2026-06-03', t_min_c: 9, t_max_c: 17, rain_mm: 1, wind_ms: null, wind_height_m: null, source: 'import' },
    ]);
  });

  it('lets the file win when the choice is replace: the stored day becomes the file’s row, blanks included', async () => {
    const { c, site } = await withStoredDays();
    const preview = await importCsv(c, site.id, file, { duplicates: 'replace' });
    expect(preview.body.counts).toEqual({ new: 1, replaced: 2, skipped: 0 });
    const res = await importCsv(c, site.id, file, { duplicates: 'replace', commit: true });
    expect(res.status).toBe(201);
    expect(res.body.changedDays).toEqual(['2026-06-01', '2026-06-02', '2026-06-03']);
    expect(await rows(site.id)).toEqual([
      // The file gave no rain for 1 June, so the stored 4 mm is gone with the rest of the old day.
      { day: '2026-06-01', t_min_c: 8, t_max_c: 16, rain_mm: null, wind_ms: null, wind_height_m: null, source: 'import' },
      { day: '2026-06-02', t_min_c: null, t_max_c: null, rain_mm: 10, wind_ms: null, wind_height_m: null, source: 'import' },
      { day: '2026-06-03', t_min_c: 9, t_max_c: 17, rain_mm: 1, wind_ms: null, wind_height_m: null, source: 'import' },
    ]);
  });

  it('counts a day typed in after the preview as stored when committing', async () => {
    const { c, site } = await withStoredDays();
    const preview = await importCsv(c, site.id, file, { duplicates: 'skip' });
    expect(preview.body.counts.new).toBe(1);
    await c.put(`/api/sites/${site.id}/weather/2026-06-03`, { rainMm: 2.2, source: 'gauge' }).expect(201);
    const res = await importCsv(c, site.id, file, { duplicates: 'skip', commit: true });
    expect(res.body.counts).toEqual({ new: 0, replaced: 0, skipped: 3 });
    expect(res.body.changedDays).toEqual([]);
    expect((await t.db('weather_days').where({ site_id: site.id, day: '2026-06-03' }).first()).rain_mm).toBe(2.2);
  });
});

describe('weather CSV import: who and the template', () => {
  it('lets a holder at the site import, refuses another member with 403, and gives anyone in the club the template', async () => {
    const { club, c, site } = await coordinatorWithSite();
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: Number(localToday('Europe/London').slice(0, 4)) }).returning('id');
    const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.person.id, source: 'manual' });
    const volunteer = await signedInMember(t, club.id, ['volunteer']);

    expect((await importCsv(holder, site.id, 'date,rain\n2026-06-01,3\n', { commit: true })).status).toBe(201);
    expect((await importCsv(volunteer, site.id, 'date,rain\n2026-06-02,3\n', { commit: true })).status).toBe(403);
    expect((await importCsv(volunteer, site.id, 'date,rain\n2026-06-02,3\n')).status).toBe(403);
    expect(await dayCount(site.id)).toBe(1);
    expect((await t.db('weather_days').where({ site_id: site.id }).first()).entered_by_user_id).toBe(holder.person.id);

    for (const agent of [c, volunteer]) {
      const template = await agent.get(`/api/sites/${site.id}/weather-imports/template.csv?units=us`).expect(200);
      expect(template.headers['content-disposition']).toContain('North field-weather-template.csv');
      const lines = template.text.replace(/^\uFEFF/, '').trim().split('\r\n');
      expect(lines[0]).toBe(HEADER);
      expect(lines).toHaveLength(4);
    }
    // The template's own rows import cleanly, in both unit systems.
    for (const units of ['metric', 'us'] as const) {
      const template = await c.get(`/api/sites/${site.id}/weather-imports/template.csv?units=${units}`).expect(200);
      const check = await importCsv(c, site.id, template.text, { units });
      expect(check.body.errors, units).toEqual([]);
      expect(check.body.rows, units).toHaveLength(3);
    }
  });
});
