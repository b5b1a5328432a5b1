import type { Knex } from 'knex';

// The demo club's last season (2026) so the spring round of 2027 can be run in the demo:
// five holders at Mossgate Lane (two still owe part of their fee), a fee schedule, and a
// waiting list of fifteen invented people with varied needs. Everything here is made up.

const DAY = 24 * 3600 * 1000;
const NOW = new Date('2026-11-20T10:00:00Z'); // fixed, so the seed is the same every run

const holders: Array<{ email: string; plot: string; paidMinor: number }> = [
  { email: 'teodor@example.org', plot: 'A-1', paidMinor: 6000 },
  { email: 'priya@example.org', plot: 'A-2', paidMinor: 6000 },
  { email: 'aiko@example.org', plot: 'B-2', paidMinor: 6000 },
  { email: 'jonah@example.org', plot: 'B-1', paidMinor: 2000 },
  { email: 'samir@example.org', plot: 'R-1', paidMinor: 0 },
];

const waitlist: Array<{ name: string; email: string; size: 'small' | 'medium' | 'large' | 'any'; accessible?: boolean; raised?: boolean; site?: string; daysAgo: number; notes?: string }> = [
  { name: 'Ines Carvalho', email: 'ines@example.org', size: 'medium', daysAgo: 700 },
  { name: 'Tom Heller', email: 'tom@example.org', size: 'large', daysAgo: 640, site: 'Mossgate Lane' },
  { name: 'Grace Adeyemi', email: 'grace@example.org', size: 'small', accessible: true, raised: true, daysAgo: 600, notes: 'Uses a wheelchair; needs a bed at 75 cm.' },
  { name: 'Pavel Novak', email: 'pavel@example.org', size: 'any', daysAgo: 540 },
  { name: 'Ruth Okonkwo', email: 'ruth@example.org', size: 'medium', site: 'Orchard Corner', daysAgo: 500 },
  { name: 'Callum Reid', email: 'callum@example.org', size: 'small', raised: true, daysAgo: 460 },
  { name: 'Mei Tanaka', email: 'mei@example.org', size: 'medium', daysAgo: 420 },
  { name: 'Oskar Lindqvist', email: 'oskar@example.org', size: 'large', daysAgo: 380 },
  { name: 'Amara Diallo', email: 'amara@example.org', size: 'any', accessible: true, daysAgo: 330 },
  { name: 'Hugo Marchetti', email: 'hugo@example.org', size: 'medium', daysAgo: 290 },
  { name: 'Nadia Rahman', email: 'nadia@example.org', size: 'small', daysAgo: 240, site: 'Mossgate Lane' },
  { name: 'Felix Baumann', email: 'felix@example.org', size: 'medium', daysAgo: 180 },
  { name: 'Sofia Petrova', email: 'sofia@example.org', size: 'any', daysAgo: 120 },
  { name: 'Kwame Mensah', email: 'kwame@example.org', size: 'large', daysAgo: 60 },
  { name: 'Lena Vogt', email: 'lena@example.org', size: 'small', raised: true, daysAgo: 14 },
];

export async function seed(knex: Knex): Promise<void> {
  const club = await knex('clubs').where({ slug: 'mossgate' }).first('id');
  await knex('seasons').where({ club_id: club.id }).delete();
  await knex('applications').where({ club_id: club.id }).delete();
  await knex('fee_schedules').where({ club_id: club.id }).delete();

  await knex('clubs').where({ id: club.id }).update({ currency: 'GBP', offer_days: 7, renewal_days: 14, time_zone: 'Europe/London' });
  // £2.50 a square metre, half price for concessions, a £15 deposit.
  await knex('fee_schedules').insert({
    club_id: club.id,
    basis: 'area',
    area_unit: 'm2',
    rate_minor_per_area: 250,
    concession_percent: 50,
    deposit_minor: 1500,
  });

  const site = await knex('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
  const coordinator = await knex('users').where({ email: 'maren@example.org' }).first('id');
  const [season] = await knex('seasons')
    .insert({ club_id: club.id, year: 2026, opened_by_user_id: coordinator.id, created_at: new Date('2026-02-01T09:00:00Z') })
    .returning('id');

  for (const h of holders) {
    const user = await knex('users').where({ email: h.email }).first('id');
    const plot = await knex('plots').where({ site_id: site.id, label: h.plot }).first('id', 'width_m', 'length_m');
    const [allocation] = await knex('allocations')
      .insert({ season_id: season.id, plot_id: plot.id, user_id: user.id, source: 'offer', created_at: new Date('2026-03-01T09:00:00Z') })
      .returning('id');
    const plotFee = Math.round(plot.width_m * plot.length_m * 250);
    const [fee] = await knex('fees')
      .insert({
        club_id: club.id,
        season_id: season.id,
        allocation_id: allocation.id,
        user_id: user.id,
        plot_id: plot.id,
        description: `Plot ${h.plot}, 2026 season`,
        plot_fee_minor: plotFee,
        deposit_minor: 1500,
        currency: 'GBP',
        due_on: '2026-04-01',
      })
      .returning('id');
    if (h.paidMinor > 0) {
      await knex('payments').insert({
        fee_id: fee.id,
        amount_minor: Math.min(h.paidMinor, plotFee + 1500),
        method: 'bank_transfer',
        paid_on: '2026-03-10',
        recorded_by_user_id: coordinator.id,
      });
    }
    await knex('plot_events').insert({
      plot_id: plot.id,
      user_id: coordinator.id,
      kind: 'accepted',
      details: JSON.stringify({ summary: `Held for 2026 (demo history)` }),
      created_at: new Date('2026-03-01T09:00:00Z'),
    });
  }

  const sites = await knex('sites').where({ club_id: club.id }).select('id', 'name');
  for (const w of waitlist) {
    const at = new Date(NOW.getTime() - w.daysAgo * DAY);
    await knex('applications').insert({
      club_id: club.id,
      name: w.name,
      email: w.email,
      preferred_size: w.size,
      needs_accessible: w.accessible ?? false,
      needs_raised: w.raised ?? false,
      preferred_site_id: w.site ? sites.find((s) => s.name === w.site)!.id : null,
      notes: w.notes ?? '',
      applied_at: at,
      queue_at: at,
      created_at: at,
    });
  }
}
