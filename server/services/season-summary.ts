import { addCalendarDays, localToday } from '@shared/dates';
import { findingKinds } from '@shared/schemas/findings';
import type { SeasonSummary, SiteSummary, WeekCoverage } from '@shared/schemas/season-summary';
import type { Db } from '../db/knex';
import { listFees } from './fee-ledger';
import { findingsForCoordinator } from './findings-views';
import { getHarvestFigures } from './harvest-figures';
import { seasonPlotStates } from './season-plots';
import type { Viewer } from './visibility';

// The coordinator's home in numbers. Each part reuses the rule of the page it links to: plot states as
// the spring round and the season map count them (newest season), fee totals as the fees page adds them
// (newest season's year), findings and harvest for the growing season under way (currentSeason), and
// shift places as the board counts them (taken or done).

export const SHIFT_WEEKS = 4;

/** The Monday on or before a YYYY-MM-DD date (whole UTC day numbers, so no clock change can move it). */
export function mondayOf(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const weekday = new Date(Date.UTC(y, m - 1, d)).getUTCDay(); // 0 = Sunday
  return addCalendarDays(isoDate, -((weekday + 6) % 7));
}

async function shiftWeeks(db: Db, clubId: number, zone: string, now: Date): Promise<WeekCoverage[]> {
  const first = mondayOf(localToday(zone, now));
  const last = addCalendarDays(first, SHIFT_WEEKS * 7 - 1);
  const rows: Array<{ on_date: string; capacity: number; taken: number }> = await db('shifts as sh')
    .leftJoin('shift_claims as c', function () {
      this.on('c.shift_id', 'sh.id').andOnIn('c.status', ['taken', 'done']);
    })
    .where('sh.club_id', clubId)
    .whereNull('sh.called_off_at')
    .whereBetween('sh.on_date', [first, last])
    .groupBy('sh.id')
    .select('sh.on_date', 'sh.capacity', db.raw('count(c.id)::int as taken'));
  const weeks = Array.from({ length: SHIFT_WEEKS }, (_, i): WeekCoverage => ({ weekStart: addCalendarDays(first, i * 7), shifts: 0, places: 0, taken: 0 }));
  for (const r of rows) {
    const week = weeks.find((w) => r.on_date >= w.weekStart && r.on_date <= addCalendarDays(w.weekStart, 6))!;
    week.shifts += 1;
    week.places += r.capacity;
    week.taken += Math.min(r.taken, r.capacity);
  }
  return weeks;
}

/** The season at a glance for a club's coordinator. */
export async function seasonSummary(db: Db, opts: { clubId: number; viewer: Viewer; now?: Date }): Promise<SeasonSummary> {
  const now = opts.now ?? new Date();
  const club = await db('clubs').where({ id: opts.clubId }).first('currency', 'time_zone');
  const zone: string = club?.time_zone ?? 'UTC';
  const season: { id: number; year: number } | null =
    (await db('seasons').where({ club_id: opts.clubId }).orderBy('year', 'desc').first('id', 'year')) ?? null;
  const liveSites: Array<{ id: number; name: string }> = await db('sites').where({ club_id: opts.clubId }).whereNull('archived_at').orderBy('name').select('id', 'name');

  const sites: SiteSummary[] = [];
  for (const site of liveSites) {
    const counts: SiteSummary = { siteId: site.id, name: site.name, free: 0, offered: 0, renewalPending: 0, taken: 0 };
    if (season) {
      for (const state of await seasonPlotStates(db, season.id, site.id, opts.viewer, now, opts.clubId)) {
        if (state.status === 'free') counts.free += 1;
        else if (state.status === 'offered') counts.offered += 1;
        else if (state.status === 'renewal_pending') counts.renewalPending += 1;
        else counts.taken += 1;
      }
    }
    sites.push(counts);
  }

  const fees = { currency: club?.currency ?? 'GBP', dueMinor: 0, paidMinor: 0, refundedMinor: 0, count: 0 };
  if (season) {
    const list = await listFees(db, opts.clubId, { year: season.year, status: 'all' });
    Object.assign(fees, { dueMinor: list.totals.dueMinor, paidMinor: list.totals.paidMinor, refundedMinor: list.totals.refundedMinor, count: list.total });
  }

  const found = await findingsForCoordinator(db, { clubId: opts.clubId, query: {}, now });
  const byKind = new Map<string, number>(findingKinds.map((k) => [k, 0]));
  for (const f of found.items) byKind.set(f.kind, (byKind.get(f.kind) ?? 0) + 1);

  const harvest = await getHarvestFigures(db, { clubId: opts.clubId, query: {}, now });

  return {
    season,
    sites,
    fees,
    shiftWeeks: await shiftWeeks(db, opts.clubId, zone, now),
    findingsSeasonYear: found.seasonYear,
    findings: findingKinds.map((kind) => ({ kind, count: byKind.get(kind)! })),
    harvest: { seasonYear: harvest.season?.year ?? null, grams: harvest.totals.grams, count: harvest.totals.count, plantings: harvest.totals.plantings, units: harvest.units },
  };
}
