import type { Knex } from 'knex';

// A synthetic network of garden sites for the benchmarks: sites of plots in a grid (3 m × 5 m with
// 0.9 m paths), five seasons, and a planting on every plot in every season, crops picked by a fixed
// pseudo-random sequence so the same arguments always give the same network. With `people`, every
// plot also has a holder allocated in every season (one in ten plots changes hands each spring),
// and there are volunteers and a season of weekly watering shifts per site, the past ones taken and
// done. Invented data.

export interface NetworkOptions {
  sites: number;
  plotsPerSite: number;
  seasons: number;
  /** The newest season's year. */
  year: number;
  onProgress?: (done: number, total: number) => void;
  /** Holders for every plot, this many volunteers, and weekly shifts from May to September. */
  people?: { volunteers: number };
}

export interface Network {
  clubId: number;
  siteIds: number[];
  /** A plot in the middle of the first site, with its planting in the newest season. */
  probe: { siteId: number; plotId: number; plantingId: number };
  plots: number;
  plantings: number;
  allocations: number;
  users: number;
  shifts: number;
  claims: number;
}

const CROPS = ['potato', 'tomato', 'radish', 'pea', 'bush-bean', 'cabbage', 'carrot', 'onion', 'lettuce', 'sweet-corn', 'sunflower', 'beet', 'zucchini', 'leek'];
const PER_ROW = 20;

function lcg(seed: number) {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return x / 2 ** 32;
  };
}

export async function buildNetwork(db: Knex, opts: NetworkOptions): Promise<Network> {
  const rand = lcg(20261202);
  const [club] = await db('clubs').insert({ name: `Network of ${opts.sites * opts.plotsPerSite} plots`, slug: `network-${opts.sites}-${opts.plotsPerSite}` }).returning('id');
  const seasons: Array<{ id: number; year: number }> = await db('seasons')
    .insert(Array.from({ length: opts.seasons }, (_, i) => ({ club_id: club.id, year: opts.year - opts.seasons + 1 + i })))
    .returning(['id', 'year']);
  const crops: Array<{ id: number; slug: string }> = await db('crops').whereNull('club_id').whereIn('slug', CROPS).select('id', 'slug');
  if (crops.length !== CROPS.length) throw new Error('Load the reference crops before building a network.');
  const rows = Math.ceil(opts.plotsPerSite / PER_ROW);
  const siteIds: number[] = [];
  let plantingCount = 0;
  let allocationCount = 0;
  let userCount = 0;
  const total = opts.sites + (opts.people ? 1 : 0);
  for (let s = 0; s < opts.sites; s++) {
    const [site] = await db('sites')
      .insert({
        club_id: club.id, name: `Site ${s + 1}`, latitude: 48 + (s % 10), longitude: 0, time_zone: 'UTC',
        width_m: PER_ROW * 3.9, length_m: rows * 5.9, path_width_m: 0.9, last_spring_frost: '04-25', first_autumn_frost: '10-15',
      })
      .returning('id');
    siteIds.push(site.id);
    const plots: Array<{ id: number }> = await db('plots')
      .insert(Array.from({ length: opts.plotsPerSite }, (_, i) => ({
        site_id: site.id, label: `${String.fromCharCode(65 + Math.floor(i / PER_ROW) % 26)}-${(i % PER_ROW) + 1}-${Math.floor(i / (PER_ROW * 26))}`,
        x_m: (i % PER_ROW) * 3.9, y_m: Math.floor(i / PER_ROW) * 5.9, width_m: 3, length_m: 5,
      })))
      .returning('id');
    if (opts.people) {
      // A holder per plot; each spring one plot in ten goes to someone new.
      const holders: Array<{ id: number }> = await db('users')
        .insert(Array.from({ length: Math.ceil(plots.length * (1 + 0.1 * (opts.seasons - 1))) }, (_, i) => ({ email: `holder-${s + 1}-${i + 1}@example.org`, name: `Holder ${s + 1}-${i + 1}` })))
        .returning('id');
      userCount += holders.length;
      await db('memberships').insert(holders.map((h) => ({ club_id: club.id, user_id: h.id, role: 'plot_holder' })));
      let next = plots.length;
      const holderOf = plots.map((_, i) => holders[i].id);
      const allocations = [];
      for (const [k, season] of seasons.entries()) {
        if (k > 0) for (let i = 0; i < plots.length; i++) if (rand() < 0.1 && next < holders.length) holderOf[i] = holders[next++].id;
        for (const [i, p] of plots.entries()) allocations.push({ season_id: season.id, plot_id: p.id, user_id: holderOf[i], source: k === 0 ? 'import' : 'renewal' });
      }
      for (let i = 0; i < allocations.length; i += 5000) await db('allocations').insert(allocations.slice(i, i + 5000));
      allocationCount += allocations.length;
    }
    const plantings = [];
    for (const p of plots) {
      for (const season of seasons) {
        const crop = crops[Math.floor(rand() * crops.length)];
        const day = 1 + Math.floor(rand() * 28);
        const month = 4 + Math.floor(rand() * 2);
        plantings.push({
          plot_id: p.id, season_id: season.id, crop_id: crop.id, method: crop.slug === 'tomato' || crop.slug === 'leek' || crop.slug === 'cabbage' ? 'transplanted' : 'sown',
          planted_on: `${season.year}-0${month}-${String(day).padStart(2, '0')}`, status: season.year === opts.year ? 'sown' : 'finished',
        });
      }
    }
    for (let i = 0; i < plantings.length; i += 2000) await db('plantings').insert(plantings.slice(i, i + 2000));
    plantingCount += plantings.length;
    opts.onProgress?.(s + 1, total);
  }
  const { shifts, claims } = opts.people ? await addVolunteersAndShifts(db, club.id, siteIds, opts.year, opts.people.volunteers, rand) : { shifts: 0, claims: 0 };
  if (opts.people) {
    userCount += opts.people.volunteers;
    opts.onProgress?.(total, total);
  }
  const middle = Math.floor(opts.plotsPerSite / 2) + Math.floor(PER_ROW / 2);
  const probePlot = await db('plots').where({ site_id: siteIds[0] }).orderBy('id').offset(Math.min(middle, opts.plotsPerSite - 1)).first('id');
  const newest = seasons[seasons.length - 1];
  const probePlanting = await db('plantings').where({ plot_id: probePlot.id, season_id: newest.id }).first('id');
  return {
    clubId: club.id,
    siteIds,
    probe: { siteId: siteIds[0], plotId: probePlot.id, plantingId: probePlanting.id },
    plots: opts.sites * opts.plotsPerSite,
    plantings: plantingCount,
    allocations: allocationCount,
    users: userCount,
    shifts,
    claims,
  };
}

/**
 * Volunteers, and an evening watering shift of 3 places every week from May to September on every
 * site; the shifts before 1 August are taken by volunteers picked at random and marked done.
 */
async function addVolunteersAndShifts(db: Knex, clubId: number, siteIds: number[], year: number, count: number, rand: () => number) {
  const people: Array<{ id: number }> = await db('users')
    .insert(Array.from({ length: count }, (_, i) => ({ email: `volunteer-${i + 1}@example.org`, name: `Volunteer ${i + 1}` })))
    .returning('id');
  await db('memberships').insert(people.map((p) => ({ club_id: clubId, user_id: p.id, role: 'volunteer' })));
  const rows = [];
  for (const siteId of siteIds) {
    for (let week = 0; week < 22; week++) {
      const day = new Date(Date.UTC(year, 4, 5 + week * 7));
      const onDate = day.toISOString().slice(0, 10);
      const startsAt = new Date(`${onDate}T18:00:00Z`);
      rows.push({
        club_id: clubId, site_id: siteId, title: `Evening watering ${onDate}`, kind: 'water', on_date: onDate, start_time: '18:00', end_time: '19:30',
        starts_at: startsAt, ends_at: new Date(startsAt.getTime() + 90 * 60_000), capacity: 3, est_hours: 1.5,
      });
    }
  }
  const shifts: Array<{ id: number; on_date: string }> = [];
  for (let i = 0; i < rows.length; i += 2000) shifts.push(...(await db('shifts').insert(rows.slice(i, i + 2000)).returning(['id', 'on_date'])));
  const claims = [];
  for (const sh of shifts) {
    if (sh.on_date >= `${year}-08-01`) continue;
    const taken = new Set<number>();
    while (taken.size < 3) taken.add(people[Math.floor(rand() * people.length)].id);
    for (const userId of taken) claims.push({ shift_id: sh.id, user_id: userId, status: 'done', via: 'board', hours: 1.5, done_at: new Date(`${sh.on_date}T19:30:00Z`) });
  }
  for (let i = 0; i < claims.length; i += 5000) await db('shift_claims').insert(claims.slice(i, i + 5000));
  return { shifts: shifts.length, claims: claims.length };
}

/** A one-line progress bar on stderr. */
export function progressBar(label: string) {
  return (done: number, total: number) => {
    const width = 30;
    const filled = Math.round((done / total) * width);
    process.stderr.write(`\r${label} [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${done}/${total}${done === total ? '\n' : ''}`);
  };
}
