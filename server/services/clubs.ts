import type { Knex } from 'knex';
import { recheckClub } from './findings';
import { kickTaskRuns, queueTaskRun } from './task-runs';
import type { ClubSettings, ClubSettingsUpdateBody } from '@shared/schemas/clubs';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';

interface ClubRow {
  id: number;
  name: string;
  slug: string;
  currency: ClubSettings['currency'];
  offer_days: number;
  renewal_days: number;
  declined_offer_policy: ClubSettings['declinedOfferPolicy'];
  allow_multiple_offers: boolean;
  time_zone: string;
  contact_email: string | null;
  fee_note: string | null;
  typical_wait: string | null;
  rotation_gap_years: number;
  shares_plot_books: boolean;
  raised_bed_water_factor: number | string;
  container_water_factor: number | string;
  volunteer_hours_required: number | string | null;
}

function toClubSettings(r: ClubRow, currencyLocked: boolean): ClubSettings {
  return {
    id: r.id,
    name: r.name,
    slug: r.slug,
    currency: r.currency,
    offerDays: r.offer_days,
    renewalDays: r.renewal_days,
    declinedOfferPolicy: r.declined_offer_policy,
    allowMultipleOffers: r.allow_multiple_offers,
    timeZone: r.time_zone,
    contactEmail: r.contact_email,
    feeNote: r.fee_note,
    typicalWait: r.typical_wait,
    rotationGapYears: r.rotation_gap_years,
    sharesPlotBooks: r.shares_plot_books,
    raisedBedWaterFactor: Number(r.raised_bed_water_factor),
    containerWaterFactor: Number(r.container_water_factor),
    volunteerHoursRequired: r.volunteer_hours_required === null ? null : Number(r.volunteer_hours_required),
    currencyLocked,
  };
}

const columns = ['id', 'name', 'slug', 'currency', 'offer_days', 'renewal_days', 'declined_offer_policy', 'allow_multiple_offers', 'time_zone',
  'contact_email', 'fee_note', 'typical_wait', 'rotation_gap_years', 'shares_plot_books', 'raised_bed_water_factor', 'container_water_factor', 'volunteer_hours_required'];

const hasFees = async (db: Db, clubId: number) => Boolean(await db('fees').where({ club_id: clubId }).first('id'));

/** The club's time zone (IANA name), in which its people see every date and time. */
export async function clubTimeZone(db: Db, clubId: number): Promise<string> {
  const row = await db('clubs').where({ id: clubId }).first('time_zone');
  return (row?.time_zone as string | undefined) ?? 'UTC';
}

/** A club's name and the spring-round rules it has chosen. */
export async function getClubSettings(db: Db, clubId: number): Promise<ClubSettings> {
  const row: ClubRow | undefined = await db('clubs').where({ id: clubId }).first(columns);
  if (!row) throw notFound('The club');
  return toClubSettings(row, await hasFees(db, clubId));
}

/**
 * Changes a club's name and rules. The currency is fixed once a fee is recorded, because fees keep the
 * currency they were charged in and the club's totals add them up as one currency.
 */
export async function updateClubSettings(db: Knex, clubId: number, body: ClubSettingsUpdateBody, opts?: { userId?: number }): Promise<ClubSettings> {
  const result = await db.transaction(async (trx) => {
    const current: ClubRow | undefined = await trx('clubs').where({ id: clubId }).forUpdate().first(columns);
    if (!current) throw notFound('The club');
    if (body.currency !== undefined && body.currency !== current.currency) {
      if (await hasFees(trx, clubId)) {
        throw new AppError('conflict', `Fees are already recorded in ${current.currency}, so the currency cannot change.`, {
          currency: `Fees are already recorded in ${current.currency}`,
        });
      }
    }
    const changes = {
      name: body.name,
      currency: body.currency,
      offer_days: body.offerDays,
      renewal_days: body.renewalDays,
      declined_offer_policy: body.declinedOfferPolicy,
      allow_multiple_offers: body.allowMultipleOffers,
      time_zone: body.timeZone,
      contact_email: body.contactEmail,
      // An emptied note is no note.
      fee_note: body.feeNote === undefined ? undefined : body.feeNote || null,
      typical_wait: body.typicalWait === undefined ? undefined : body.typicalWait || null,
      rotation_gap_years: body.rotationGapYears,
      shares_plot_books: body.sharesPlotBooks,
      raised_bed_water_factor: body.raisedBedWaterFactor,
      container_water_factor: body.containerWaterFactor,
      volunteer_hours_required: body.volunteerHoursRequired,
    };
    const set = Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined));
    if (Object.keys(set).length > 0) {
      await trx('clubs').where({ id: clubId }).update({ ...set, updated_at: trx.fn.now() });
    }
    if (body.rotationGapYears !== undefined && body.rotationGapYears !== current.rotation_gap_years) await recheckClub(trx, clubId);
    const factorChanged =
      (body.raisedBedWaterFactor !== undefined && body.raisedBedWaterFactor !== Number(current.raised_bed_water_factor)) ||
      (body.containerWaterFactor !== undefined && body.containerWaterFactor !== Number(current.container_water_factor));
    // New factors change the litres of every raised bed and container: each site's tasks are re-planned by a run.
    if (factorChanged) {
      for (const site of await trx('sites').where({ club_id: clubId }).whereNull('archived_at').select('id')) {
        await queueTaskRun(trx, { clubId, siteId: site.id, userId: opts?.userId ?? null });
      }
    }
    return { settings: await getClubSettings(trx, clubId), factorChanged };
  });
  if (result.factorChanged) kickTaskRuns(db);
  return result.settings;
}
