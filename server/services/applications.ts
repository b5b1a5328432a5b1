import type { Knex } from 'knex';
import type { z } from 'zod';
import type {
  ApplicationBody,
  ApplyInfo,
  WaitlistEntry,
  WaitlistQuerySchema,
} from '@shared/schemas/applications';
import type { WaitlistMove } from '@shared/schemas/waitlist';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import type { Mailer } from '../mail/mailer';
import { lapseOverdueOffersOfClub } from './offers';
import { enqueueMail, kickMail } from './outbox';
import { alreadyOnWaitlistMail, applicationReceivedMail } from '../mail/waitlist-templates';
import { clubIdVia, type ClubLookup } from './memberships';

const DAY_MS = 24 * 60 * 60 * 1000;
// Gaps used when someone is moved to either end of the queue, and the least gap kept when the
// queue has to be spread out (rows written in one statement share a timestamp).
const END_GAP_US = 1_000_000;
const SPREAD_GAP_US = 1_000;

export type WaitlistQuery = z.infer<typeof WaitlistQuerySchema>;

export interface ApplicationRow {
  id: number;
  club_id: number;
  user_id: number | null;
  name: string;
  email: string;
  phone: string;
  preferred_size: WaitlistEntry['preferredSize'];
  needs_accessible: boolean;
  needs_raised: boolean;
  preferred_site_id: number | null;
  notes: string;
  status: WaitlistEntry['status'];
  removed_reason: string | null;
  applied_at: Date;
  queue_at: Date;
}

type EntryRow = ApplicationRow & { position: number | null; preferred_site_name: string | null };

function toEntry(r: EntryRow, now: Date): WaitlistEntry {
  return {
    id: r.id,
    position: r.position === null ? null : Number(r.position),
    name: r.name,
    email: r.email,
    phone: r.phone,
    preferredSize: r.preferred_size,
    needsAccessible: r.needs_accessible,
    needsRaised: r.needs_raised,
    preferredSiteId: r.preferred_site_id,
    preferredSiteName: r.preferred_site_name,
    notes: r.notes,
    status: r.status,
    appliedAt: r.applied_at.toISOString(),
    waitedDays: Math.max(0, Math.floor((now.getTime() - r.applied_at.getTime()) / DAY_MS)),
  };
}

/** The club a waiting list application belongs to, or null. */
export const clubOfApplication: ClubLookup = (db, applicationId) => db('applications').where({ id: applicationId }).select('club_id');

async function clubBySlug(db: Db, slug: string) {
  const club: { id: number; name: string; offer_days: number; fee_note: string | null; typical_wait: string | null } | undefined = await db('clubs')
    .where({ slug })
    .first('id', 'name', 'offer_days', 'fee_note', 'typical_wait');
  if (!club) throw notFound('The club');
  return club;
}

/** What the public application form shows: the club's name, its sites, and its notes on fees and waiting. */
export async function applyInfo(db: Db, slug: string): Promise<ApplyInfo> {
  const club = await clubBySlug(db, slug);
  const sites = await db('sites').where({ club_id: club.id }).orderBy('name').select('id', 'name');
  return { clubName: club.name, sites, feeNote: club.fee_note, typicalWait: club.typical_wait };
}

const waitingCount = async (db: Db, clubId: number) =>
  Number((await db('applications').where({ club_id: clubId, status: 'waiting' }).count({ n: '*' }))[0].n);

/** The 1-based place of a waiting application in its club's queue. */
async function positionOf(db: Db, app: { id: number; club_id: number }): Promise<number> {
  const [{ n }] = await db('applications as a')
    .where({ 'a.club_id': app.club_id, 'a.status': 'waiting' })
    .whereRaw('(a.queue_at, a.id) <= ((select queue_at from applications where id = ?), ?)', [app.id, app.id])
    .count({ n: '*' });
  return Number(n);
}

const isLiveEmailClash = (err: unknown) =>
  (err as { code?: string; constraint?: string })?.code === '23505' &&
  (err as { constraint?: string }).constraint === 'applications_live_email_unique';

/**
 * Puts someone on a club's waiting list from the public form and e-mails them their place. A filled-in
 * honeypot gets the same kind of answer but nothing is stored or sent, so a bot learns nothing.
 */
export async function submitApplication(
  db: Knex,
  mailer: Mailer,
  opts: { slug: string; body: ApplicationBody },
): Promise<{ position: number; message: string }> {
  const { body } = opts;
  const club = await clubBySlug(db, opts.slug);
  const receipt = (position: number) => ({
    position,
    message: `You are number ${position} on the waiting list of ${club.name}. We have e-mailed ${body.email} a confirmation with what happens next.`,
  });
  if (body.website.trim() !== '') return receipt((await waitingCount(db, club.id)) + 1);

  let siteName: string | null = null;
  if (body.preferredSiteId !== null) {
    const site = await db('sites').where({ id: body.preferredSiteId, club_id: club.id }).first('name');
    if (!site) {
      throw new AppError('validation_failed', 'Some fields need attention.', {
        preferredSiteId: "Choose one of the club's sites, or no preference",
      });
    }
    siteName = site.name;
  }
  /**
   * An address already waiting (or with a plot on offer) gets the answer a new application gets, so
   * the form tells nobody who is on the list; the address's owner is told by e-mail instead.
   */
  const alreadyListed = async () => {
    const live = await db('applications')
      .where({ club_id: club.id })
      .whereIn('status', ['waiting', 'offered'])
      .whereRaw('lower(email) = lower(?)', [body.email])
      .first('id', 'club_id', 'name', 'email', 'status');
    if (!live) return null;
    const place = live.status === 'waiting' ? await positionOf(db, live) : null;
    await enqueueMail(db, { clubId: club.id, kind: 'application_received' }, alreadyOnWaitlistMail({ to: live.email, name: live.name, clubName: club.name, position: place }));
    kickMail(db, mailer);
    return receipt((await waitingCount(db, club.id)) + 1);
  };
  const listed = await alreadyListed();
  if (listed) return listed;

  const account = await db('users').whereRaw('lower(email) = lower(?)', [body.email]).first('id');
  try {
    // The confirmation is written to the outbox with the application, so neither is kept without the other.
    const result = await db.transaction(async (trx) => {
      const [row] = await trx('applications')
        .insert({
          club_id: club.id,
          user_id: account?.id ?? null,
          name: body.name,
          email: body.email,
          phone: body.phone,
          preferred_size: body.preferredSize,
          needs_accessible: body.needsAccessible,
          needs_raised: body.needsRaised,
          preferred_site_id: body.preferredSiteId,
          notes: body.notes,
        })
        .returning(['id', 'club_id']);
      const position = await positionOf(trx, row);
      await enqueueMail(trx, { clubId: club.id, kind: 'application_received' }, applicationReceivedMail({
          to: body.email,
          name: body.name,
          clubName: club.name,
          position,
          preferredSize: body.preferredSize,
          needs: [
            ...(body.needsRaised ? ['a raised bed'] : []),
            ...(body.needsAccessible ? ['a wheelchair-accessible bed'] : []),
          ],
          siteName,
          offerDays: club.offer_days,
        }),
      );
      return receipt(position);
    });
    kickMail(db, mailer);
    return result;
  } catch (err) {
    if (isLiveEmailClash(err)) {
      const listedMeanwhile = await alreadyListed();
      if (listedMeanwhile) return listedMeanwhile;
    }
    throw err;
  }
}

function entries(db: Db, clubId: number) {
  return db
    .with('queue', (q) =>
      q
        .from('applications')
        .where({ club_id: clubId, status: 'waiting' })
        .select('id', db.raw('row_number() over (order by queue_at, id) as position')),
    )
    .from('applications as a')
    .leftJoin('queue as q', 'q.id', 'a.id')
    .leftJoin('sites as s', 's.id', 'a.preferred_site_id')
    .where('a.club_id', clubId)
    .select('a.*', 'q.position', 's.name as preferred_site_name');
}

/** A club's waiting list in queue order; positions count only the people waiting, whatever the filter shows. */
export async function listWaitlist(db: Knex, clubId: number, query: WaitlistQuery, now = new Date()) {
  await lapseOverdueOffersOfClub(db, clubId, now);
  const q = entries(db, clubId).orderBy('a.queue_at').orderBy('a.id');
  if (query.status !== 'all') q.where('a.status', query.status);
  if (query.needs === 'accessible') q.where('a.needs_accessible', true);
  if (query.needs === 'raised') q.where('a.needs_raised', true);
  if (query.siteId) q.where('a.preferred_site_id', query.siteId);
  const rows: EntryRow[] = await q;
  return { items: rows.map((r) => toEntry(r, now)), page: 1, total: rows.length };
}

/** One application as the waiting list shows it. */
export async function getWaitlistEntry(db: Db, applicationId: number, now = new Date()): Promise<WaitlistEntry> {
  const clubId = await clubIdVia(db, clubOfApplication, applicationId);
  if (!clubId) throw notFound('The application');
  const row: EntryRow = await entries(db, clubId).where('a.id', applicationId).first();
  return toEntry(row, now);
}

interface QueueRow {
  id: number;
  /** queue_at in microseconds since 1970, exact, so midpoints never lose the database's precision. */
  us: number;
}

/** The club's waiting rows in queue order, locked until the transaction ends. */
async function lockQueue(trx: Knex.Transaction, clubId: number): Promise<QueueRow[]> {
  const rows = await trx('applications')
    .where({ club_id: clubId, status: 'waiting' })
    .orderBy('queue_at')
    .orderBy('id')
    .forUpdate()
    .select('id', trx.raw('(extract(epoch from queue_at) * 1000000)::bigint as us'));
  return rows.map((r) => ({ id: r.id, us: Number(r.us) }));
}

const setQueueAt = (trx: Knex.Transaction, id: number, us: number) =>
  trx('applications')
    .where({ id })
    .update({ queue_at: trx.raw("timestamptz 'epoch' + ? * interval '1 microsecond'", [us]), updated_at: trx.fn.now() });

/** Loads an application for a queue change, refusing one that is not waiting. */
async function waitingApplication(trx: Knex.Transaction, applicationId: number, verb: string) {
  const app: Pick<ApplicationRow, 'id' | 'club_id' | 'status'> | undefined = await trx('applications')
    .where({ id: applicationId })
    .first('id', 'club_id', 'status');
  if (!app) throw notFound('The application');
  const queue = await lockQueue(trx, app.club_id);
  const index = queue.findIndex((r) => r.id === applicationId);
  if (index < 0) throw new AppError('conflict', `Only people who are waiting can be ${verb}; this application is ${app.status}.`);
  return { app, queue, index };
}

/**
 * Moves a waiting application to another place in the queue by giving it a queue time between its
 * new neighbours, and records who moved it, from where to where, and why.
 */
export async function moveApplication(
  db: Knex,
  opts: { applicationId: number; userId: number; toPosition: number; reason: string },
): Promise<WaitlistEntry> {
  await db.transaction(async (trx) => {
    const { queue, index } = await waitingApplication(trx, opts.applicationId, 'moved');
    const fromPosition = index + 1;
    if (opts.toPosition > queue.length) {
      throw new AppError('validation_failed', 'Some fields need attention.', {
        toPosition: `${queue.length} ${queue.length === 1 ? 'person is' : 'people are'} waiting; choose 1 to ${queue.length}`,
      });
    }
    if (opts.toPosition === fromPosition) {
      throw new AppError('validation_failed', 'Some fields need attention.', {
        toPosition: `They are already number ${fromPosition}`,
      });
    }
    let others = queue.filter((r) => r.id !== opts.applicationId);
    const tooClose = others.some((r, i) => i > 0 && r.us - others[i - 1].us < 2);
    if (tooClose) {
      // Spread equal queue times a millisecond apart, keeping everyone's order, so a midpoint exists.
      const spread: QueueRow[] = [];
      for (const r of others) {
        const last = spread[spread.length - 1];
        const us = last && r.us < last.us + SPREAD_GAP_US ? last.us + SPREAD_GAP_US : r.us;
        if (us !== r.us) await setQueueAt(trx, r.id, us);
        spread.push({ id: r.id, us });
      }
      others = spread;
    }
    const prev = others[opts.toPosition - 2];
    const next = others[opts.toPosition - 1];
    const us = !prev ? next.us - END_GAP_US : !next ? prev.us + END_GAP_US : Math.floor((prev.us + next.us) / 2);
    await setQueueAt(trx, opts.applicationId, us);
    await trx('waitlist_moves').insert({
      application_id: opts.applicationId,
      from_position: fromPosition,
      to_position: opts.toPosition,
      kind: 'reordered',
      reason: opts.reason,
      user_id: opts.userId,
    });
  });
  return getWaitlistEntry(db, opts.applicationId);
}

/** Takes a waiting application off the list, keeping the reason and who did it. */
export async function removeApplication(
  db: Knex,
  opts: { applicationId: number; userId: number; reason: string },
): Promise<WaitlistEntry> {
  await db.transaction(async (trx) => {
    const { index } = await waitingApplication(trx, opts.applicationId, 'removed');
    await trx('applications')
      .where({ id: opts.applicationId })
      .update({ status: 'removed', removed_reason: opts.reason, updated_at: trx.fn.now() });
    await trx('waitlist_moves').insert({
      application_id: opts.applicationId,
      from_position: index + 1,
      to_position: null,
      kind: 'removed',
      reason: opts.reason,
      user_id: opts.userId,
    });
  });
  return getWaitlistEntry(db, opts.applicationId);
}

/** Every recorded change to an application's place, oldest first. */
export async function applicationHistory(db: Db, applicationId: number) {
  const rows = await db('waitlist_moves as m')
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where('m.application_id', applicationId)
    .orderBy('m.created_at')
    .orderBy('m.id')
    .select('m.*', 'u.name as by_name');
  const items: WaitlistMove[] = rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    fromPosition: r.from_position,
    toPosition: r.to_position,
    reason: r.reason,
    byName: r.by_name,
    createdAt: new Date(r.created_at).toISOString(),
  }));
  return { items, page: 1, total: items.length };
}
