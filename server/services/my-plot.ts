import type { MyPlot } from '@shared/schemas/my-plot';
import type { Db } from '../db/knex';
import { plotFacts } from './link-preview';

/**
 * The signed-in person's own plot in a club (from the newest season that gives them one, on a live
 * site) and their own renewal still waiting for an answer. Nothing here names anyone else, so every
 * member may ask; someone with no plot gets nulls.
 */
export async function myPlot(db: Db, clubId: number, userId: number, now: Date = new Date()): Promise<MyPlot> {
  const held = await db('allocations as a')
    .join('seasons as se', 'se.id', 'a.season_id')
    .join('plots as p', 'p.id', 'a.plot_id')
    .join('sites as s', 's.id', 'p.site_id')
    .where({ 'se.club_id': clubId, 'a.user_id': userId, 'a.status': 'active' })
    .whereNull('p.deleted_at')
    .whereNull('s.archived_at')
    .orderBy('se.year', 'desc')
    .first('p.id as plot_id', 'p.kind', 'se.year', 's.id as site_id', 's.name as site_name', 's.width_m', 's.length_m', 's.units');
  const pending = await db('renewals as r')
    .join('seasons as se', 'se.id', 'r.season_id')
    .where({ 'se.club_id': clubId, 'r.user_id': userId, 'r.status': 'pending' })
    .where('r.deadline', '>', now)
    .orderBy('se.year', 'desc')
    .first('r.id', 'r.plot_id', 'r.deadline', 'se.year');

  let holding: MyPlot['holding'] = null;
  if (held) {
    const facts = await plotFacts(db, held.plot_id);
    holding = {
      plotId: held.plot_id,
      label: facts.label,
      kind: held.kind,
      size: facts.size,
      area: facts.area,
      seasonYear: held.year,
      site: { id: held.site_id, name: held.site_name, width: Number(held.width_m), length: Number(held.length_m), units: held.units },
    };
  }
  let renewal: MyPlot['renewal'] = null;
  if (pending) {
    const facts = await plotFacts(db, pending.plot_id);
    renewal = {
      id: pending.id,
      seasonYear: pending.year,
      plotLabel: facts.label,
      siteName: facts.siteName,
      deadline: new Date(pending.deadline).toISOString(),
    };
  }
  return { holding, renewal };
}
