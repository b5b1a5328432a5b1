import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { localToday } from '@shared/dates';
import { plusDays } from '@shared/plot-book';
import { weekStartOf } from '@shared/tasks/generate';
import { buildClub, buildCrop } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';
import { generateSiteTasks, regenerateTasks } from '../../server/services/tasks';
import { runQueuedTaskRuns, taskRunsIdle } from '../../server/services/task-runs';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

// "This season" is the newest season whose year has begun in the club's zone (UTC here). The
// generator is run with an injected time in that year, never with sleeps.
const YEAR = Number(localToday('UTC').slice(0, 4));
const at = (date: string) => new Date(`${date}T12:00:00Z`);

/** A club this season: Hana holds A-1 (in the ground, 3 m × 2 m) and B-1 (a raised bed), Ines holds A-2; a coordinator, a volunteer. */
async function club() {
  const c = await buildClub(t.db, { name: 'Brookside Allotment Society' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const hana = await signedInMember(t, c.id, ['plot_holder']);
  const ines = await signedInMember(t, c.id, ['plot_holder']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const elsewhere = await buildClub(t.db, { name: 'Hill End' });
  const outsider = await signedInMember(t, elsewhere.id, ['coordinator']);
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Brook field', latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20, last_spring_frost: '04-25', first_autumn_frost: '10-15' })
    .returning('id');
  const plots: Array<{ id: number; label: string }> = await t.db('plots')
    .insert([
      { site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 2 },
      { site_id: site.id, label: 'A-2', x_m: 4, y_m: 0, width_m: 3, length_m: 2 },
      { site_id: site.id, label: 'B-1', x_m: 0, y_m: 5, width_m: 1, length_m: 2, kind: 'raised_bed' },
    ])
    .returning(['id', 'label']);
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: YEAR }).returning('id');
  await t.db('allocations').insert([
    { season_id: season.id, plot_id: plots[0].id, user_id: hana.person.id, source: 'manual' },
    { season_id: season.id, plot_id: plots[2].id, user_id: hana.person.id, source: 'manual' },
    { season_id: season.id, plot_id: plots[1].id, user_id: ines.person.id, source: 'manual' },
  ]);
  const radish = await buildCrop(t.db, 'radish');
  const lettuce = await buildCrop(t.db, 'lettuce');
  const plant = async (plotId: number, cropId: number, plantedOn: string, method = 'sown') =>
    (await t.db('plantings').insert({ plot_id: plotId, season_id: season.id, crop_id: cropId, method, planted_on: plantedOn, status: 'sown' }).returning('id'))[0].id as number;
  return { club: c, siteId: site.id as number, a1: plots[0].id, a2: plots[1].id, b1: plots[2].id, seasonId: season.id as number, coordinator, hana, ines, volunteer, outsider, radish, lettuce, plant };
}

/** Every task row with its physical row version: a write of any kind changes `xmin`. */
const snapshot = async () => (await t.db.raw('select id, xmin::text as xmin, status, due_on, amount_mm from tasks order by id')).rows;

describe('generating a site’s tasks', () => {
  it('creates the season’s tasks once: a second run with nothing changed writes nothing', async () => {
    const s = await club();
    await s.plant(s.a1, s.radish.id, `${YEAR}-04-11`);
    await s.plant(s.b1, s.lettuce.id, `${YEAR}-05-01`, 'transplanted');
    const first = await generateSiteTasks(t.db, s.siteId, { now: at(`${YEAR}-04-01`) });
    expect(first.total).toBe(2);
    expect(first.created).toBeGreaterThan(10);
    const kinds = new Set((await t.db('tasks').select('kind')).map((r: { kind: string }) => r.kind));
    for (const k of ['weed', 'thin', 'side_dress', 'harvest', 'scout']) expect(kinds.has(k), k).toBe(true);
    const before = await snapshot();
    const second = await generateSiteTasks(t.db, s.siteId, { now: at(`${YEAR}-04-01`) });
    expect(second).toEqual({ total: 2, created: 0, updated: 0, removed: 0 });
    expect(await snapshot()).toEqual(before);
  });

  it('moves a planting’s future tasks when its date moves, and leaves done ones alone', async () => {
    const s = await club();
    const id = await s.plant(s.a1, s.radish.id, `${YEAR}-04-11`);
    await generateSiteTasks(t.db, s.siteId, { now: at(`${YEAR}-04-01`) });
    const firstWeed = await t.db('tasks').where({ planting_id: id, kind: 'weed' }).orderBy('due_on').first();
    await t.db('tasks').where({ id: firstWeed.id }).update({ status: 'done', done_on: `${YEAR}-04-18` });
    const doneRow = (await t.db.raw('select xmin::text as xmin, due_on from tasks where id = ?', [firstWeed.id])).rows[0];

    await t.db('plantings').where({ id }).update({ planted_on: `${YEAR}-04-25` });
    const moved = await t.db.transaction((trx) => regenerateTasks(trx, s.siteId, { plantingIds: [id], now: at(`${YEAR}-04-01`) }));
    expect(moved.created).toBeGreaterThan(0);
    expect(moved.removed).toBeGreaterThan(0);
    const harvest = await t.db('tasks').where({ planting_id: id, kind: 'harvest', status: 'open' }).first();
    // Radish, 25–50 days from sowing (Encyclopaedia Britannica, in the crop notes).
    expect(harvest.window_from).toBe(plusDays(`${YEAR}-04-25`, 25));
    expect(harvest.window_to).toBe(plusDays(`${YEAR}-04-25`, 50));
    const openWeeds = await t.db('tasks').where({ planting_id: id, kind: 'weed', status: 'open' }).orderBy('due_on').select('due_on');
    expect(openWeeds[0].due_on).toBe(plusDays(`${YEAR}-04-25`, 7));
    expect((await t.db.raw('select xmin::text as xmin, due_on from tasks where id = ?', [firstWeed.id])).rows[0]).toEqual(doneRow);

    // Finished: its open tasks go, the done one stays.
    await t.db('plantings').where({ id }).update({ status: 'finished' });
    await t.db.transaction((trx) => regenerateTasks(trx, s.siteId, { plantingIds: [id], now: at(`${YEAR}-04-01`) }));
    expect(await t.db('tasks').where({ planting_id: id }).select('id', 'status')).toEqual([{ id: firstWeed.id, status: 'done' }]);
  });

  it('waters only what the rain logged leaves short, and shrinks the task as rain is logged', async () => {
    const s = await club();
    // Lettuce transplanted on 1 May: the week of Monday 22 June falls in its FAO-56 mid-season stage (Kc 1.00, Tables 11 and 12).
    const today = `${YEAR}-06-25`;
    const monday = weekStartOf(today);
    const id = await s.plant(s.a1, s.lettuce.id, `${YEAR}-05-01`, 'transplanted');
    await generateSiteTasks(t.db, s.siteId, { now: at(today) });
    const key = `water:${monday}`;
    const dry = await t.db('tasks').where({ planting_id: id, gen_key: key }).first();
    expect(Number(dry.amount_mm)).toBeGreaterThan(20);
    // 1 mm over 1 m² is 1 L: the 6 m² plot's litres are six times its millimetres.
    expect(Number(dry.amount_l)).toBeCloseTo(Number(dry.amount_mm) * 6, 0);
    expect(dry.details).toMatch(/rain logged 0 mm/);

    await t.db('weather_days').insert({ site_id: s.siteId, day: monday, rain_mm: 8, source: 'gauge' });
    await generateSiteTasks(t.db, s.siteId, { now: at(today) });
    const wetter = await t.db('tasks').where({ planting_id: id, gen_key: key }).first();
    expect(Number(wetter.amount_mm)).toBeCloseTo(Number(dry.amount_mm) - 8, 0);
    expect(wetter.details).toMatch(/rain logged 8 mm/);

    await t.db('weather_days').insert({ site_id: s.siteId, day: plusDays(monday, 1), rain_mm: 30, source: 'gauge' });
    await generateSiteTasks(t.db, s.siteId, { now: at(today) });
    expect(await t.db('tasks').where({ planting_id: id, gen_key: key }).first()).toBeUndefined();
  });

  it('needs more water in a raised bed, by the club’s factor', async () => {
    const s = await club();
    const today = `${YEAR}-06-25`;
    const monday = weekStartOf(today);
    const ground = await s.plant(s.a1, s.lettuce.id, `${YEAR}-05-01`, 'transplanted');
    const raised = await s.plant(s.b1, s.lettuce.id, `${YEAR}-05-01`, 'transplanted');
    await t.db('clubs').where({ id: s.club.id }).update({ raised_bed_water_factor: 1.5 });
    await generateSiteTasks(t.db, s.siteId, { now: at(today) });
    const a = await t.db('tasks').where({ planting_id: ground, gen_key: `water:${monday}` }).first();
    const b = await t.db('tasks').where({ planting_id: raised, gen_key: `water:${monday}` }).first();
    expect(Number(b.amount_mm)).toBeCloseTo(Number(a.amount_mm) * 1.5, 0);
  });
});

describe('tasks over HTTP', () => {
  it('re-plans every site when a coordinator changes the club’s raised-bed factor, and refuses a factor below 1', async () => {
    const s = await club();
    const today = localToday('UTC');
    const monday = weekStartOf(today);
    const id = await s.plant(s.b1, s.lettuce.id, plusDays(today, -20), 'transplanted');
    await generateSiteTasks(t.db, s.siteId);
    const before = await t.db('tasks').where({ planting_id: id, gen_key: `water:${monday}` }).first();
    const low = await s.coordinator.patch(`/api/clubs/${s.club.id}`, { raisedBedWaterFactor: 0.5 });
    expect(low.status).toBe(400);
    expect(low.body.error.fields).toHaveProperty('raisedBedWaterFactor');
    expect((await s.hana.patch(`/api/clubs/${s.club.id}`, { raisedBedWaterFactor: 2.4 })).status).toBe(403);
    const res = await s.coordinator.patch(`/api/clubs/${s.club.id}`, { raisedBedWaterFactor: 2.4 });
    expect(res.status).toBe(200);
    expect(res.body.raisedBedWaterFactor).toBe(2.4);
    expect(res.body.containerWaterFactor).toBe(1.5);
    await runQueuedTaskRuns(t.db);
    await taskRunsIdle(t.db);
    const after = await t.db('tasks').where({ planting_id: id, gen_key: `water:${monday}` }).first();
    // computed: from the default 1.2 to 2.4 doubles the need of the raised bed
    expect(Number(after.amount_mm)).toBeCloseTo(Number(before.amount_mm) * 2, 0);
    expect((await t.db('task_runs').where({ site_id: s.siteId }).first()).status).toBe('done');
  });

  it('re-plans the litres when a coordinator resizes a plot or makes it a raised bed', async () => {
    const s = await club();
    const today = localToday('UTC');
    const monday = weekStartOf(today);
    const id = await s.plant(s.a1, s.lettuce.id, plusDays(today, -20), 'transplanted');
    await generateSiteTasks(t.db, s.siteId);
    // No weather logged: the rule of thumb (about 25 mm a week) over this week's days, well above the 5 mm floor.
    const before = await t.db('tasks').where({ planting_id: id, gen_key: `water:${monday}` }).first();
    expect(Number(before.amount_l)).toBeGreaterThan(0);
    const plot = await t.db('plots').where({ id: s.a1 }).first('version');
    const wider = await s.coordinator.patch(`/api/plots/${s.a1}`, { version: plot.version, length: 4 });
    expect(wider.status).toBe(200);
    const after = await t.db('tasks').where({ planting_id: id, gen_key: `water:${monday}` }).first();
    // computed: 1 mm over 1 m² = 1 L, so the same depth over twice the area (3 m × 4 m against 3 m × 2 m) is twice the litres
    expect(Number(after.amount_mm)).toBeCloseTo(Number(before.amount_mm), 6);
    expect(Number(after.amount_l)).toBeCloseTo(Number(before.amount_l) * 2, 0);
    expect(after.id).toBe(before.id);
    const raised = await s.coordinator.patch(`/api/plots/${s.a1}`, { version: wider.body.version, kind: 'raised_bed' });
    expect(raised.status).toBe(200);
    const bed = await t.db('tasks').where({ planting_id: id, gen_key: `water:${monday}` }).first();
    // The club's raised-bed factor (1.2 by default, our own figure) scales the need.
    expect(Number(bed.amount_mm)).toBeCloseTo(Number(before.amount_mm) * 1.2, 0);
  });

  it('shows a plot’s tasks to those who may read its plot book, and lets the holder mark one done (409 on a stale version)', async () => {
    const s = await club();
    const today = localToday('UTC');
    await s.plant(s.a1, s.lettuce.id, plusDays(today, -14), 'transplanted');
    await generateSiteTasks(t.db, s.siteId);
    const res = await s.hana.get(`/api/plots/${s.a1}/tasks`);
    expect(res.status).toBe(200);
    expect(res.body.canWrite).toBe(true);
    const open = [...res.body.overdue, ...res.body.thisWeek, ...res.body.nextWeek, ...res.body.later];
    expect(open.length).toBeGreaterThan(0);
    expect((await s.ines.get(`/api/plots/${s.a1}/tasks`)).status).toBe(403);
    expect((await s.outsider.get(`/api/plots/${s.a1}/tasks`)).status).toBe(404);
    expect((await (await browserLikeAgent(t.app)).get(`/api/plots/${s.a1}/tasks`)).status).toBe(401);

    const task = open[0];
    expect((await s.ines.post(`/api/tasks/${task.id}/done`, { version: task.version })).status).toBe(403);
    const done = await s.hana.post(`/api/tasks/${task.id}/done`, { version: task.version, note: 'Hoed both rows' });
    expect(done.status).toBe(200);
    expect(done.body.status).toBe('done');
    expect(done.body.doneOn).toBe(today);
    expect((await s.hana.post(`/api/tasks/${task.id}/done`, { version: task.version })).status).toBe(409);
    expect((await s.hana.post(`/api/tasks/${task.id}/reopen`, { version: done.body.version })).body.status).toBe('open');
    const bad = await s.hana.post(`/api/tasks/${task.id}/done`, { version: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('version');
  });

  it('re-plans the watering in the same request when the holder logs rain from the gauge', async () => {
    const s = await club();
    const today = localToday('UTC');
    await s.plant(s.a1, s.lettuce.id, plusDays(today, -30), 'transplanted');
    await generateSiteTasks(t.db, s.siteId);
    const key = `water:${weekStartOf(today)}`;
    const dry = await t.db('tasks').where({ plot_id: s.a1, gen_key: key }).first();
    expect(dry).toBeDefined();
    const logged = await s.hana.put(`/api/sites/${s.siteId}/weather/${today}`, { rainMm: 6 });
    expect(logged.status).toBeLessThan(300);
    const wetter = await t.db('tasks').where({ plot_id: s.a1, gen_key: key }).first();
    expect(Number(wetter.amount_mm)).toBeCloseTo(Number(dry.amount_mm) - 6, 0);
    expect(wetter.details).toMatch(/rain logged 6 mm/);
  });

  it('hands a holder’s watering to the volunteers while away, and a volunteer may then do it', async () => {
    const s = await club();
    const today = localToday('UTC');
    await s.plant(s.a1, s.lettuce.id, plusDays(today, -14), 'transplanted');
    await generateSiteTasks(t.db, s.siteId);
    const water = await t.db('tasks').where({ plot_id: s.a1, kind: 'water', status: 'open' }).orderBy('due_on').first();
    expect(water).toBeDefined();
    expect((await s.volunteer.post(`/api/tasks/${water.id}/done`, { version: water.version })).status).toBe(403);
    const away = await s.hana.post(`/api/plots/${s.a1}/handovers`, { fromOn: today, toOn: plusDays(today, 13), kinds: ['water'] });
    expect(away.status).toBe(201);
    expect(away.body.tasksHanded).toBeGreaterThan(0);
    const handed = await t.db('tasks').where({ id: water.id }).first();
    expect(handed.for_volunteers).toBe(true);
    expect((await s.volunteer.post(`/api/tasks/${water.id}/done`, { version: handed.version })).status).toBe(200);
    expect((await s.ines.post(`/api/plots/${s.a1}/handovers`, { fromOn: today, toOn: today })).status).toBe(403);
    const wrong = await s.hana.post(`/api/plots/${s.a1}/handovers`, { fromOn: today, toOn: plusDays(today, -1) });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('toOn');
    expect((await s.hana.delete(`/api/handovers/${away.body.id}`)).status).toBe(204);
  });

  it('lets coordinators add repeating site tasks, list and export a site’s tasks, and run the generator with progress', async () => {
    const s = await club();
    const today = localToday('UTC');
    await s.plant(s.a1, s.radish.id, today);
    const add = await s.coordinator.post(`/api/sites/${s.siteId}/tasks`, {
      title: 'Turn the compost bays', kind: 'other', dueOn: today, windowDays: 3, repeatEveryDays: 7, repeatUntil: plusDays(today, 28),
    });
    expect(add.status).toBe(201);
    expect(add.body.created).toBe(5);
    expect((await s.hana.post(`/api/sites/${s.siteId}/tasks`, { title: 'x', dueOn: today })).status).toBe(403);
    const half = await s.coordinator.post(`/api/sites/${s.siteId}/tasks`, { title: 'x', dueOn: today, repeatEveryDays: 7 });
    expect(half.status).toBe(400);
    expect(half.body.error.fields).toHaveProperty('repeatUntil');

    const run = await s.coordinator.post(`/api/sites/${s.siteId}/task-runs`, {});
    expect(run.status).toBe(202);
    // The request started the run in this process; whatever is left, the minute job would take.
    await taskRunsIdle(t.db);
    await runQueuedTaskRuns(t.db);
    const after = await s.coordinator.get(`/api/task-runs/${run.body.id}`);
    expect(after.body).toMatchObject({ status: 'done', total: 1, done: 1 });
    expect(after.body.created).toBeGreaterThan(0);
    // A member without the coordinator role: 403, as on every route (DEVELOPERS.md); outside the club it is 404.
    expect((await s.hana.get(`/api/task-runs/${run.body.id}`)).status).toBe(403);

    const list = await s.coordinator.get(`/api/sites/${s.siteId}/tasks?kind=other`);
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(5);
    expect(list.body.items.every((x: { kind: string }) => x.kind === 'other')).toBe(true);
    expect((await s.hana.get(`/api/sites/${s.siteId}/tasks`)).status).toBe(403);
    const csv = await s.coordinator.get(`/api/sites/${s.siteId}/tasks.csv?kind=thin`);
    expect(csv.status).toBe(200);
    const lines = csv.text.trim().split(/\r?\n/);
    expect(lines[0]).toMatch(/^Due,From,To,Plot,Crop,Kind,Task/);
    expect(lines.length).toBe(2);
    expect(lines[1]).toContain('Thin the radish');
    const water = await s.hana.get(`/api/sites/${s.siteId}/water?weeks=4`);
    expect(water.status).toBe(200);
    expect(water.body.weeks).toHaveLength(4);
    expect((await s.outsider.get(`/api/sites/${s.siteId}/water`)).status).toBe(404);
  });
});
