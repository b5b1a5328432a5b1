import type { Knex } from 'knex';
import { addCalendarDays } from '../shared/dates';
import { generateSiteTasks } from '../server/services/tasks';

// The 2026 season's tasks on the demo sites, as if the generator had run every Monday from April to the
// seed's date: each week plans what is due, and what the week before left behind was mostly done by the
// holder (some marked not needed). All invented for the demo; the rules are the product's own.

const SEASON_START = '2026-04-06'; // a Monday
const SEED_END = '2026-11-16'; // the Monday of the week of the seed's fixed date (seeds/03: 20 Nov 2026)

export async function seed(knex: Knex): Promise<void> {
  const club = await knex('clubs').where({ slug: 'mossgate' }).first('id');
  const sites: Array<{ id: number }> = await knex('sites').where({ club_id: club.id }).whereNull('archived_at').select('id');
  for (let monday = SEASON_START; monday <= SEED_END; monday = addCalendarDays(monday, 7)) {
    for (const site of sites) await generateSiteTasks(knex, site.id, { now: new Date(`${monday}T06:00:00Z`) });
    // What closed before this Monday: done by the holder on the last day of its window, one in seven not needed.
    const closed: Array<{ id: number; plot_id: number | null; window_to: string }> = await knex('tasks')
      .where({ club_id: club.id, status: 'open' })
      .where('window_to', '<', monday)
      .select('id', 'plot_id', 'window_to');
    for (const t of closed) {
      const holder = t.plot_id
        ? await knex('allocations as a').join('seasons as s', 's.id', 'a.season_id').where({ 'a.plot_id': t.plot_id, 's.year': 2026 }).first('a.user_id')
        : null;
      const skipped = t.id % 7 === 0;
      await knex('tasks')
        .where({ id: t.id })
        .update({
          status: skipped ? 'skipped' : 'done',
          done_on: t.window_to,
          done_by_user_id: holder?.user_id ?? null,
          done_note: skipped ? 'Not needed this time.' : '',
          version: 2,
        });
    }
  }
}
