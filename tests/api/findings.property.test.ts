import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localToday } from '@shared/dates';
import { ObservationBodySchema } from '@shared/schemas/plot-book';
import { checkPlots } from '@shared/findings';
import { buildClub, buildCrop, buildMember } from '../factories';
import { setupTestApp, truncateAll } from '../helpers/app';
import { loadCheckContext } from '../../server/services/findings';
import { createObservation } from '../../server/services/observations';
import { createPlanting, deletePlanting, updatePlanting } from '../../server/services/plantings';
import { updatePlot } from '../../server/services/plots';
import { AppError } from '../../server/errors';

// Property: after any sequence of edits (plantings added, changed and removed, plots moved,
// observations recorded), the stored findings equal a full check of the site from scratch.

const t = setupTestApp();
afterAll(() => t.close());

const YEAR = Number(localToday('UTC').slice(0, 4));
// Crops with relations to each other across plots (potato with radish, tomato, sunflower) and tall ones for shade.
const SLUGS = ['potato', 'tomato', 'radish', 'sunflower', 'pea', 'bush-bean', 'cabbage', 'sweet-corn'] as const;

let s: { siteId: number; coordinatorId: number; plotIds: number[]; crops: number[]; lastSeasonId: number; seasonId: number };

beforeAll(async () => {
  await truncateAll(t.db);
  const c = await buildClub(t.db, { name: 'Property Lane' });
  const coordinator = await buildMember(t.db, { clubId: c.id, roles: ['coordinator'] });
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Grid', latitude: 51.5, longitude: 0, time_zone: 'UTC', width_m: 40, length_m: 40, path_width_m: 0.9, last_spring_frost: '05-01' })
    .returning('id');
  // A 3 × 3 grid of 3 m × 4 m plots with 0.9 m paths, the middle one a shallow raised bed.
  const rows = [];
  for (let i = 0; i < 9; i++) {
    rows.push({ site_id: site.id, label: `G-${i + 1}`, x_m: (i % 3) * 3.9, y_m: Math.floor(i / 3) * 4.9, width_m: 3, length_m: 4, kind: i === 4 ? 'raised_bed' : 'in_ground', soil_depth_m: i === 4 ? 0.15 : null, soil_ph: i === 2 ? 7.6 : null });
  }
  const plots: { id: number }[] = await t.db('plots').insert(rows).returning('id');
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: YEAR - 1 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: YEAR }).returning('id');
  const crops = [];
  for (const slug of SLUGS) crops.push((await buildCrop(t.db, slug)).id);
  s = { siteId: site.id, coordinatorId: coordinator.id, plotIds: plots.map((p) => p.id), crops, lastSeasonId: last.id, seasonId: season.id };
});

type Command =
  | { op: 'plant'; plot: number; crop: number; month: number; part: boolean }
  | { op: 'pastPlant'; plot: number; crop: number }
  | { op: 'change'; which: number; crop: number; month: number }
  | { op: 'remove'; which: number }
  | { op: 'move'; plot: number; dx: number }
  | { op: 'clubroot'; plot: number };

const command: fc.Arbitrary<Command> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ op: fc.constant('plant' as const), plot: fc.nat(8), crop: fc.nat(SLUGS.length - 1), month: fc.integer({ min: 4, max: 6 }), part: fc.boolean() }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant('pastPlant' as const), plot: fc.nat(8), crop: fc.nat(SLUGS.length - 1) }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant('change' as const), which: fc.nat(), crop: fc.nat(SLUGS.length - 1), month: fc.integer({ min: 4, max: 6 }) }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant('remove' as const), which: fc.nat() }) },
  // Half a metre leaves one neighbour and comes nearer the other; 20 m takes the plot out of the grid.
  { weight: 3, arbitrary: fc.record({ op: fc.constant('move' as const), plot: fc.nat(8), dx: fc.constantFrom(-0.5, 0.5, 20, -20) }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant('clubroot' as const), plot: fc.nat(8) }) },
);

async function run(cmd: Command): Promise<void> {
  const userId = s.coordinatorId;
  const plantings: { id: number; version: number }[] = await t.db('plantings').where({ season_id: s.seasonId }).orderBy('id').select('id', 'version');
  const month = (m: number) => `${YEAR}-0${m}-10`;
  try {
    if (cmd.op === 'plant') {
      await createPlanting(t.db, {
        plotId: s.plotIds[cmd.plot],
        userId,
        body: {
          cropId: s.crops[cmd.crop], variety: '', part: cmd.part ? { x: 0, y: 0, width: 1.5, length: 2 } : null, method: 'sown', plantedOn: month(cmd.month),
          layout: 'rows', rowCount: null, quantity: null, status: 'planned', notes: '', keepReason: 'property test',
        },
      });
    } else if (cmd.op === 'pastPlant') {
      // Earlier seasons are corrected by coordinators; a direct row, then the site re-checked by the next edit.
      await t.db('plantings').insert({ plot_id: s.plotIds[cmd.plot], season_id: s.lastSeasonId, crop_id: s.crops[cmd.crop], method: 'sown', planted_on: `${YEAR - 1}-05-01` });
      const [p] = await t.db('plantings').where({ season_id: s.lastSeasonId }).orderBy('id', 'desc').limit(1).select('id', 'version');
      await updatePlanting(t.db, { plantingId: p.id, userId, body: { version: p.version, notes: 'entered late', keepReason: 'property test' } });
    } else if (cmd.op === 'change' && plantings.length) {
      const p = plantings[cmd.which % plantings.length];
      await updatePlanting(t.db, { plantingId: p.id, userId, body: { version: p.version, cropId: s.crops[cmd.crop], plantedOn: month(cmd.month), keepReason: 'property test' } });
    } else if (cmd.op === 'remove' && plantings.length) {
      await deletePlanting(t.db, { plantingId: plantings[cmd.which % plantings.length].id, userId });
    } else if (cmd.op === 'move') {
      const plot = await t.db('plots').where({ id: s.plotIds[cmd.plot] }).first('x_m', 'version');
      await updatePlot(t.db, { plotId: s.plotIds[cmd.plot], userId, body: { version: plot.version, x: Math.max(0, Number(plot.x_m) + cmd.dx) } });
    } else if (cmd.op === 'clubroot') {
      await createObservation(t.db, {
        plotId: s.plotIds[cmd.plot],
        userId,
        body: ObservationBodySchema.parse({ pestSlug: 'clubroot', severity: 'moderate', observedOn: `${YEAR - 1}-09-01` }),
      });
    }
  } catch (err) {
    // A move onto another plot (409) or off the site (400) is refused and changes nothing; anything else is a failure.
    if (!(cmd.op === 'move' && err instanceof AppError && (err.status === 409 || err.status === 400))) throw err;
  }
}

const key = (f: { plantingId: number; key: string; severity: string; message: string }) => `${f.plantingId}|${f.key}|${f.severity}|${f.message}`;

describe('stored findings', () => {
  it('equal a full re-check after random sequences of edits', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(command, { minLength: 4, maxLength: 24 }), async (cmds) => {
        await t.db('plantings').delete();
        await t.db('observations').delete();
        await t.db('findings').delete();
        for (const [i, id] of s.plotIds.entries()) await t.db('plots').where({ id }).update({ x_m: (i % 3) * 3.9, y_m: Math.floor(i / 3) * 4.9 });
        for (const c of cmds) await run(c);
        const fresh = checkPlots(await loadCheckContext(t.db, s.siteId)).map(key).sort();
        const rows: Array<{ planting_id: number; key: string; severity: string; message: string }> = await t.db('findings').select('planting_id', 'key', 'severity', 'message');
        const stored = rows.map((r) => key({ plantingId: r.planting_id, key: r.key, severity: r.severity, message: r.message })).sort();
        expect(stored).toEqual(fresh);
      }),
      { numRuns: 40, seed: 20261202 },
    );
  }, 240_000);
});
