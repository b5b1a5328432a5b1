import crypto from 'node:crypto';
import type { Knex } from 'knex';
import { localToday } from '@shared/dates';
import type { Shift, ShiftDoneBody, ShiftLinkPreview } from '@shared/schemas/shifts';
import { shiftCaution } from '@shared/shifts';
import { weekStartOf } from '@shared/tasks/generate';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { storageKey, type Storage } from '../storage';
import {
  placeReleasedMail,
  shiftCalledOffMail,
  shiftDigestMail,
  shiftHelpMail,
  shiftReminderMail,
  shiftTakenMail,
  type OpenShiftLine,
  type ShiftWords,
} from '../mail/shift-templates';
import { shiftCalendar } from './calendar-feeds';
import { inspectImage, reencodeImage } from './images';
import { photoLimits, STORED_PHOTO_SIDE_PX } from './observations';
import { remindersOff, stopLink } from './mail-stops';
import { enqueueMail, kickMail } from './outbox';
import { shiftRows, toShiftViews, type ShiftRow, type Viewer } from './shifts';
import { hashToken, newToken } from './tokens';

// Places on shifts: taking one (from the board or an e-mailed link), giving it back, saying it is
// done (with a note, hours and a photo), calling a shift off, asking the volunteers for help, and
// the jobs: the weekly e-mail of open shifts, the reminder the day before, and places not marked done.
// A place is taken under a lock on the shift's row, so with N places exactly N people get one.

/** How long after a shift ends its done link and button still work (a place not marked done is "missed" meanwhile). */
export const DONE_GRACE_DAYS = 7;
const DAY_MS = 86_400_000;

interface Ctx {
  db: Knex;
  mailer: Mailer;
  publicUrl: string;
  /** Where done photos go; without one, a photo sent with a done place is not kept. */
  storage?: Storage;
  now?: Date;
}

const linkUrl = (publicUrl: string, token: string) => `${publicUrl}/shift-link?token=${token}`;
const shiftUrl = (publicUrl: string, clubId: number, shiftId: number) => `${publicUrl}/clubs/${clubId}/shifts/${shiftId}`;
const choicesUrl = (publicUrl: string, clubId: number) => `${publicUrl}/clubs/${clubId}/my-shifts`;

async function kindsOf(db: Db, shiftId: number): Promise<string[]> {
  return db('shift_tasks as st').join('tasks as t', 't.id', 'st.task_id').where('st.shift_id', shiftId).distinct().pluck('t.kind');
}

async function wordsFor(db: Db, row: ShiftRow): Promise<ShiftWords> {
  const kinds = await kindsOf(db, row.id);
  return {
    title: row.title,
    siteName: row.site_name,
    date: row.on_date,
    startTime: row.start_time,
    endTime: row.end_time,
    timeZone: row.time_zone,
    estHours: Number(row.est_hours),
    instructions: row.instructions,
    caution: shiftCaution([row.kind, ...(kinds as ShiftRow['kind'][])]),
  };
}

/** A new single-use link for one person and one shift; only its hash is kept. */
async function makeLink(trx: Db, opts: { shiftId: number; userId: number; claimId: number | null; purpose: 'claim' | 'release' | 'done'; expiresAt: Date }) {
  const { token, hash } = newToken();
  await trx('shift_links').insert({ shift_id: opts.shiftId, user_id: opts.userId, claim_id: opts.claimId, purpose: opts.purpose, token_hash: hash, expires_at: opts.expiresAt });
  return token;
}

const doneUntil = (row: ShiftRow) => new Date(new Date(row.ends_at).getTime() + DONE_GRACE_DAYS * DAY_MS);

async function lockedShift(trx: Knex.Transaction, shiftId: number): Promise<ShiftRow> {
  // The lock every place on this shift goes through.
  const locked = await trx('shifts').where({ id: shiftId }).forUpdate().first('id');
  if (!locked) throw notFound('The shift');
  return shiftRows(trx).where('sh.id', shiftId).first();
}

async function mayVolunteer(db: Db, clubId: number, userId: number): Promise<boolean> {
  const roles = await db('memberships').where({ club_id: clubId, user_id: userId }).pluck('role');
  return roles.includes('volunteer') || roles.includes('coordinator');
}

/** The confirmation: release and done links and the shift as a calendar file. */
async function mailTaken(trx: Db, ctx: Ctx, row: ShiftRow, claimId: number, userId: number) {
  const user = await trx('users').where({ id: userId }).first('name', 'email');
  const club = await trx('clubs').where({ id: row.club_id }).first('name');
  const words = await wordsFor(trx, row);
  const release = await makeLink(trx, { shiftId: row.id, userId, claimId, purpose: 'release', expiresAt: new Date(row.starts_at) });
  const done = await makeLink(trx, { shiftId: row.id, userId, claimId, purpose: 'done', expiresAt: doneUntil(row) });
  const ics = shiftCalendar(
    club.name,
    [
      {
        id: row.id,
        title: row.title,
        siteName: row.site_name,
        startsAt: new Date(row.starts_at),
        endsAt: new Date(row.ends_at),
        timeZone: row.time_zone,
        instructions: row.instructions,
        caution: words.caution,
        url: shiftUrl(ctx.publicUrl, row.club_id, row.id),
        calledOff: false,
      },
    ],
    new URL(ctx.publicUrl).host,
  );
  await enqueueMail(
    trx,
    { clubId: row.club_id, kind: 'shift_taken' },
    shiftTakenMail({
      to: user.email,
      name: user.name,
      clubName: club.name,
      shift: words,
      releaseUrl: linkUrl(ctx.publicUrl, release),
      doneUrl: linkUrl(ctx.publicUrl, done),
      ics: { filename: 'shift.ics', contentType: 'text/calendar; charset=utf-8; method=PUBLISH', content: ics },
    }),
  );
}

/**
 * Takes a place for `userId` under the shift's lock: refused when the shift was called off, has
 * started, or every place is taken (409 "already covered"). Taking a place one already holds is no change.
 */
async function takePlace(trx: Knex.Transaction, ctx: Ctx, shiftId: number, userId: number, via: 'link' | 'board'): Promise<{ row: ShiftRow; claimId: number; isNew: boolean }> {
  const now = ctx.now ?? new Date();
  const row = await lockedShift(trx, shiftId);
  if (row.called_off_at) throw new AppError('conflict', 'This shift was called off.');
  if (new Date(row.starts_at) <= now) throw new AppError('conflict', 'This shift has already started.');
  const claims = await trx('shift_claims').where({ shift_id: shiftId }).whereIn('status', ['taken', 'done']).select('id', 'user_id');
  const mine = claims.find((c: { user_id: number }) => c.user_id === userId);
  if (mine) return { row, claimId: mine.id, isNew: false };
  if (claims.length >= row.capacity) throw new AppError('conflict', 'Already covered: every place on this shift is taken. Thank you for offering.');
  const [claim] = await trx('shift_claims').insert({ shift_id: shiftId, user_id: userId, via }).returning('id');
  await mailTaken(trx, ctx, row, claim.id, userId);
  return { row, claimId: claim.id, isNew: true };
}

async function viewOf(db: Db, shiftId: number, viewer: Viewer | null, now?: Date): Promise<Shift> {
  const row = await shiftRows(db).where('sh.id', shiftId).first();
  const [view] = await toShiftViews(db, [row], viewer, now);
  return view;
}

/** A signed-in volunteer (or coordinator) takes a place from the board. */
export async function claimShift(ctx: Ctx, opts: { shiftId: number; viewer: Viewer }): Promise<Shift> {
  if (!opts.viewer.roles.includes('volunteer') && !opts.viewer.roles.includes('coordinator')) {
    throw new AppError('forbidden', 'Only the club’s volunteers can take places on shifts. Ask a coordinator to add the volunteer role.');
  }
  await ctx.db.transaction((trx) => takePlace(trx, ctx, opts.shiftId, opts.viewer.userId, 'board'));
  kickMail(ctx.db, ctx.mailer);
  return viewOf(ctx.db, opts.shiftId, opts.viewer, ctx.now);
}

/** Gives a place back before the shift starts; the coordinators are told. */
async function releasePlace(trx: Knex.Transaction, ctx: Ctx, shiftId: number, userId: number): Promise<void> {
  const now = ctx.now ?? new Date();
  const row = await lockedShift(trx, shiftId);
  const claim = await trx('shift_claims').where({ shift_id: shiftId, user_id: userId, status: 'taken' }).first('id');
  if (!claim) throw new AppError('conflict', 'You hold no place on this shift.');
  if (new Date(row.starts_at) <= now) throw new AppError('conflict', 'This shift has started; tell the coordinator if you cannot be there.');
  await trx('shift_claims').where({ id: claim.id }).update({ status: 'released', released_at: now });
  // Links of that place stop working; a new place needs a new link.
  await trx('shift_links').where({ claim_id: claim.id }).whereNull('used_at').update({ used_at: now });
  if (row.called_off_at) return;
  const who = await trx('users').where({ id: userId }).first('name');
  const club = await trx('clubs').where({ id: row.club_id }).first('name');
  const [{ n }] = await trx('shift_claims').where({ shift_id: shiftId }).whereIn('status', ['taken', 'done']).count({ n: '*' });
  const words = await wordsFor(trx, row);
  const coordinators = await trx('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.club_id': row.club_id, 'm.role': 'coordinator' }).select('u.name', 'u.email');
  for (const c of coordinators) {
    await enqueueMail(
      trx,
      { clubId: row.club_id, kind: 'shift_released' },
      placeReleasedMail({ to: c.email, name: c.name, clubName: club.name, who: who.name, shift: words, placesLeft: row.capacity - Number(n), shiftUrl: shiftUrl(ctx.publicUrl, row.club_id, row.id) }),
    );
  }
}

export async function releaseShift(ctx: Ctx, opts: { shiftId: number; viewer: Viewer }): Promise<Shift> {
  await ctx.db.transaction((trx) => releasePlace(trx, ctx, opts.shiftId, opts.viewer.userId));
  kickMail(ctx.db, ctx.mailer);
  return viewOf(ctx.db, opts.shiftId, opts.viewer, ctx.now);
}

/** Checks and re-encodes a done photo (as the plot book does), and keeps it under a random name. */
async function storePhoto(storage: Storage, bytes: Uint8Array): Promise<string> {
  await inspectImage(bytes, photoLimits);
  const stored = await reencodeImage(bytes, { limits: photoLimits, maxSidePx: STORED_PHOTO_SIDE_PX, format: 'webp', quality: 80 });
  const name = `${crypto.randomBytes(16).toString('hex')}.webp`;
  await storage.put(shiftPhotoKey(name), stored.bytes, 'image/webp');
  return name;
}

/** A done photo's storage key (`shift-photos/<name>`). */
export const shiftPhotoKey = (name: string) => storageKey('shift-photos', name);

/**
 * Runs the done write with a photo already stored: a refused write takes the new file with it, and a
 * photo it replaced is deleted after the commit, so no file is left that no claim points at.
 */
async function withDonePhoto(storage: Storage | undefined, photo: string | null, write: () => Promise<string | null>): Promise<void> {
  const remove = (name: string) => storage!.delete(shiftPhotoKey(name));
  let replaced: string | null;
  try {
    replaced = await write();
  } catch (err) {
    if (photo) await remove(photo);
    throw err;
  }
  if (photo && replaced && replaced !== photo) await remove(replaced);
}

/**
 * Marks a place done: from the start of the shift's day until DONE_GRACE_DAYS after it ends (a
 * missed place can still be marked). The shift's tasks are done with it.
 */
/** Returns the photo the claim held before, when a new one replaces it. */
async function markDone(trx: Knex.Transaction, ctx: Ctx, shiftId: number, userId: number, body: ShiftDoneBody, photo: string | null): Promise<string | null> {
  const now = ctx.now ?? new Date();
  const row = await lockedShift(trx, shiftId);
  if (row.called_off_at) throw new AppError('conflict', 'This shift was called off.');
  const claim = await trx('shift_claims').where({ shift_id: shiftId, user_id: userId }).whereIn('status', ['taken', 'missed', 'done']).orderBy('id', 'desc').first('id', 'status', 'photo_path');
  if (!claim) throw new AppError('conflict', 'You hold no place on this shift.');
  if (localToday(row.time_zone, now) < row.on_date) throw new AppError('conflict', 'This shift has not started yet. Mark it done on the day.');
  if (now > doneUntil(row)) throw new AppError('conflict', `This shift ended more than ${DONE_GRACE_DAYS} days ago; ask the coordinator to record it.`);
  await trx('shift_claims')
    .where({ id: claim.id })
    .update({ status: 'done', done_at: now, hours: body.hours ?? Number(row.est_hours), note: body.note, ...(photo ? { photo_path: photo } : {}) });
  await trx('tasks as t')
    .whereIn('t.id', trx('shift_tasks').where({ shift_id: shiftId }).select('task_id'))
    .where('t.status', 'open')
    .update({ status: 'done', done_on: row.on_date, done_by_user_id: userId, done_note: body.note, version: trx.raw('version + 1'), updated_at: trx.fn.now() });
  return photo ? (claim.photo_path as string | null) : null;
}

export async function doneShift(ctx: Ctx, opts: { shiftId: number; viewer: Viewer; body: ShiftDoneBody; photo?: Uint8Array }): Promise<Shift> {
  const photo = opts.photo && ctx.storage ? await storePhoto(ctx.storage, opts.photo) : null;
  await withDonePhoto(ctx.storage, photo, () => ctx.db.transaction((trx) => markDone(trx, ctx, opts.shiftId, opts.viewer.userId, opts.body, photo)));
  return viewOf(ctx.db, opts.shiftId, opts.viewer, ctx.now);
}

interface LinkRow {
  id: number;
  shift_id: number;
  user_id: number;
  claim_id: number | null;
  purpose: 'claim' | 'release' | 'done';
  expires_at: Date;
  used_at: Date | null;
}

async function linkByToken(db: Db, token: string, lock = false): Promise<LinkRow> {
  let q = db('shift_links').where({ token_hash: hashToken(token) });
  if (lock) q = q.forUpdate();
  const row: LinkRow | undefined = await q.first();
  if (!row) throw new AppError('not_found', 'This link is not one of ours, or it was replaced. Look for a newer e-mail.');
  return row;
}

async function openShiftsOf(db: Db, clubId: number, exceptId: number, now: Date): Promise<Shift[]> {
  const rows: ShiftRow[] = await shiftRows(db)
    .where('sh.club_id', clubId)
    .whereNot('sh.id', exceptId)
    .whereNull('sh.called_off_at')
    .where('sh.starts_at', '>', now)
    .orderBy('sh.starts_at')
    .limit(40);
  return (await toShiftViews(db, rows, null, now)).filter((s) => s.state === 'needs_people').slice(0, 6);
}

/** What a link leads to; opening it changes nothing (mail scanners fetch links). */
export async function previewShiftLink(db: Db, opts: { token: string; now?: Date }): Promise<ShiftLinkPreview> {
  const now = opts.now ?? new Date();
  const link = await linkByToken(db, opts.token);
  const row: ShiftRow = await shiftRows(db).where('sh.id', link.shift_id).first();
  const viewer = { userId: link.user_id, roles: [] };
  const [shift] = await toShiftViews(db, [row], viewer, now);
  const user = await db('users').where({ id: link.user_id }).first('name');
  const club = await db('clubs').where({ id: row.club_id }).first('name');
  let state: ShiftLinkPreview['state'];
  const mine = shift.myClaim;
  if (row.called_off_at) state = 'called_off';
  else if (link.purpose === 'claim') {
    if (mine && (mine.status === 'taken' || mine.status === 'done')) state = 'yours';
    else if (link.used_at) state = 'used';
    else if (new Date(link.expires_at) <= now) state = 'expired';
    else if (shift.taken >= shift.capacity) state = 'full';
    else state = 'ready';
  } else if (link.used_at) state = 'used';
  else if (new Date(link.expires_at) <= now) state = 'expired';
  else state = 'ready';
  const otherShifts = state === 'full' || state === 'expired' || state === 'called_off' ? await openShiftsOf(db, row.club_id, row.id, now) : [];
  return { purpose: link.purpose, state, forName: user.name.split(/\s+/)[0], clubName: club.name, shift, otherShifts };
}

function refuseLink(link: LinkRow, purpose: LinkRow['purpose'], now: Date) {
  if (link.purpose !== purpose) throw new AppError('validation_failed', 'This link is for something else.', { token: `This is a ${link.purpose} link` });
  if (link.used_at) throw new AppError('conflict', 'This link was already used.');
  if (new Date(link.expires_at) <= now) throw new AppError('gone', 'This link has expired.');
}

/** Confirms a claim link: a place for the link's person only, under the same lock as the board. */
export async function claimByLink(ctx: Ctx, opts: { token: string }): Promise<ShiftLinkPreview> {
  const now = ctx.now ?? new Date();
  await ctx.db.transaction(async (trx) => {
    const link = await linkByToken(trx, opts.token, true);
    refuseLink(link, 'claim', now);
    const row = await trx('shifts').where({ id: link.shift_id }).first('club_id');
    if (!(await mayVolunteer(trx, row.club_id, link.user_id))) throw new AppError('forbidden', 'This link’s person is no longer one of the club’s volunteers.');
    const taken = await takePlace(trx, { ...ctx, now }, link.shift_id, link.user_id, 'link');
    await trx('shift_links').where({ id: link.id }).update({ used_at: now, claim_id: taken.claimId });
  });
  kickMail(ctx.db, ctx.mailer);
  return previewShiftLink(ctx.db, { token: opts.token, now });
}

export async function releaseByLink(ctx: Ctx, opts: { token: string }): Promise<ShiftLinkPreview> {
  const now = ctx.now ?? new Date();
  await ctx.db.transaction(async (trx) => {
    const link = await linkByToken(trx, opts.token, true);
    refuseLink(link, 'release', now);
    await releasePlace(trx, { ...ctx, now }, link.shift_id, link.user_id);
    await trx('shift_links').where({ id: link.id }).update({ used_at: now });
  });
  kickMail(ctx.db, ctx.mailer);
  return previewShiftLink(ctx.db, { token: opts.token, now });
}

export async function doneByLink(ctx: Ctx, opts: { token: string; body: ShiftDoneBody; photo?: Uint8Array }): Promise<ShiftLinkPreview> {
  const now = ctx.now ?? new Date();
  // The link is checked before a photo is decoded, so a stranger cannot make the server do that work.
  refuseLink(await linkByToken(ctx.db, opts.token), 'done', now);
  const photo = opts.photo && ctx.storage ? await storePhoto(ctx.storage, opts.photo) : null;
  await withDonePhoto(ctx.storage, photo, () =>
    ctx.db.transaction(async (trx) => {
      const link = await linkByToken(trx, opts.token, true);
      refuseLink(link, 'done', now);
      const replaced = await markDone(trx, { ...ctx, now }, link.shift_id, link.user_id, opts.body, photo);
      await trx('shift_links').where({ id: link.id }).update({ used_at: now });
      return replaced;
    }),
  );
  return previewShiftLink(ctx.db, { token: opts.token, now });
}

/** Calls a shift off: everyone holding a place is told; its tasks are free for another shift. */
export async function callOffShift(ctx: Ctx, opts: { shiftId: number; viewer: Viewer; version: number }): Promise<Shift> {
  const now = ctx.now ?? new Date();
  await ctx.db.transaction(async (trx) => {
    const row = await lockedShift(trx, opts.shiftId);
    if (row.version !== opts.version) throw new AppError('conflict', 'Someone changed this shift since you opened it. It has been reloaded.');
    if (row.called_off_at) throw new AppError('conflict', 'This shift is already called off.');
    if (new Date(row.ends_at) <= now) throw new AppError('conflict', 'This shift is over and cannot be called off.');
    const words = await wordsFor(trx, row);
    await trx('shifts').where({ id: row.id }).update({ called_off_at: now, version: row.version + 1, updated_at: trx.fn.now() });
    await trx('shift_tasks').where({ shift_id: row.id }).delete();
    const club = await trx('clubs').where({ id: row.club_id }).first('name');
    const people = await trx('shift_claims as c').join('users as u', 'u.id', 'c.user_id').where({ 'c.shift_id': row.id, 'c.status': 'taken' }).select('u.name', 'u.email');
    for (const p of people) {
      await enqueueMail(trx, { clubId: row.club_id, kind: 'shift_called_off' }, shiftCalledOffMail({ to: p.email, name: p.name, clubName: club.name, shift: words }));
    }
  });
  kickMail(ctx.db, ctx.mailer);
  return viewOf(ctx.db, opts.shiftId, opts.viewer, now);
}

/** Volunteers who want e-mail about shifts in a club (their choice per club; on until they say no). */
function volunteersOf(db: Db, clubId: number) {
  return db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .leftJoin('volunteer_settings as v', (j) => j.on('v.club_id', 'm.club_id').andOn('v.user_id', 'm.user_id'))
    .where({ 'm.club_id': clubId, 'm.role': 'volunteer' })
    .select('u.id', 'u.name', 'u.email', db.raw('coalesce(v.help_mail, true) as help_mail'), db.raw('case when v.user_id is null then 1 else v.digest_day end as digest_day'));
}

/** A coordinator asks the volunteers for help with one shift: each gets a link of their own. */
export async function askForHelp(ctx: Ctx, opts: { shiftId: number; viewer: Viewer; note: string }): Promise<{ sent: number; skipped: number }> {
  const now = ctx.now ?? new Date();
  const result = await ctx.db.transaction(async (trx) => {
    const row = await lockedShift(trx, opts.shiftId);
    if (row.called_off_at) throw new AppError('conflict', 'This shift was called off.');
    if (new Date(row.starts_at) <= now) throw new AppError('conflict', 'This shift has started.');
    const holding = await trx('shift_claims').where({ shift_id: row.id }).whereIn('status', ['taken', 'done']).pluck('user_id');
    if (holding.length >= row.capacity) throw new AppError('conflict', 'Every place is taken already.');
    const club = await trx('clubs').where({ id: row.club_id }).first('name');
    const from = await trx('users').where({ id: opts.viewer.userId }).first('name');
    const words = await wordsFor(trx, row);
    let sent = 0;
    let skipped = 0;
    for (const v of await volunteersOf(trx, row.club_id)) {
      if (holding.includes(v.id)) continue;
      if (!v.help_mail) {
        skipped++;
        continue;
      }
      const token = await makeLink(trx, { shiftId: row.id, userId: v.id, claimId: null, purpose: 'claim', expiresAt: new Date(row.starts_at) });
      await enqueueMail(
        trx,
        { clubId: row.club_id, kind: 'shift_help' },
        shiftHelpMail({
          to: v.email,
          name: v.name,
          clubName: club.name,
          from: from.name,
          note: opts.note,
          item: { shift: words, placesLeft: row.capacity - holding.length, claimUrl: linkUrl(ctx.publicUrl, token) },
          choicesUrl: choicesUrl(ctx.publicUrl, row.club_id),
          stop: await stopLink(trx, { userId: v.id, clubId: row.club_id, kind: 'shift_help', publicUrl: ctx.publicUrl, clubName: club.name }),
        }),
      );
      sent++;
    }
    return { sent, skipped };
  });
  kickMail(ctx.db, ctx.mailer);
  return result;
}

/** The hour of the day in a zone at `now` (0–23) and its weekday (0 Sunday … 6 Saturday). */
function localClock(timeZone: string, now: Date): { hour: number; weekday: number } {
  const parts = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', hourCycle: 'h23', weekday: 'short' }).formatToParts(now);
  const hour = Number(parts.find((p) => p.type === 'hour')?.value ?? 0);
  const weekday = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'].indexOf(parts.find((p) => p.type === 'weekday')?.value ?? 'Mon');
  return { hour, weekday };
}

/** Digests go out from this hour of the club's day. */
export const DIGEST_HOUR = 7;

/**
 * The weekly e-mail of open shifts (the next 14 days), on each volunteer's chosen day from
 * DIGEST_HOUR in the club's zone; once per person, club and week whichever server runs it (a row
 * in shift_digests is the proof). Nobody gets an empty digest.
 */
export async function sendShiftDigests(db: Knex, mailer: Mailer, opts: { publicUrl: string; now?: Date }): Promise<number> {
  const now = opts.now ?? new Date();
  let sent = 0;
  const clubs = await db('clubs as c').whereExists(db('shifts as sh').whereRaw('sh.club_id = c.id').whereNull('sh.called_off_at').where('sh.starts_at', '>', now)).select('c.id', 'c.name', 'c.time_zone');
  for (const club of clubs) {
    const zone = club.time_zone ?? 'UTC';
    const clock = localClock(zone, now);
    if (clock.hour < DIGEST_HOUR) continue;
    const weekStart = weekStartOf(localToday(zone, now));
    const rows: ShiftRow[] = await shiftRows(db)
      .where('sh.club_id', club.id)
      .whereNull('sh.called_off_at')
      .where('sh.starts_at', '>', now)
      .where('sh.starts_at', '<', new Date(now.getTime() + 14 * DAY_MS))
      .orderBy('sh.starts_at');
    const views = await toShiftViews(db, rows, null, now);
    const open = rows.filter((_, i) => views[i].state === 'needs_people');
    if (!open.length) continue;
    const words = await Promise.all(open.map((r) => wordsFor(db, r)));
    const people = (await volunteersOf(db, club.id)).filter((v: { digest_day: number | null }) => v.digest_day === clock.weekday);
    for (const v of people) {
      const mine = new Set(await db('shift_claims').where({ user_id: v.id }).whereIn('shift_id', open.map((r) => r.id)).whereIn('status', ['taken', 'done']).pluck('shift_id'));
      const theirs = open.map((r, i) => ({ r, w: words[i], view: views[rows.indexOf(r)] })).filter((x) => !mine.has(x.r.id));
      if (!theirs.length) continue;
      const did = await db.transaction(async (trx) => {
        const inserted = await trx('shift_digests').insert({ club_id: club.id, user_id: v.id, week_start: weekStart }).onConflict(['club_id', 'user_id', 'week_start']).ignore().returning('user_id');
        if (!inserted.length) return false;
        const lines: OpenShiftLine[] = [];
        for (const x of theirs) {
          const token = await makeLink(trx, { shiftId: x.r.id, userId: v.id, claimId: null, purpose: 'claim', expiresAt: new Date(x.r.starts_at) });
          lines.push({ shift: x.w, placesLeft: x.view.capacity - x.view.taken, claimUrl: linkUrl(opts.publicUrl, token) });
        }
        await enqueueMail(trx, { clubId: club.id, kind: 'shift_digest' }, shiftDigestMail({
            to: v.email,
            name: v.name,
            clubName: club.name,
            lines,
            choicesUrl: choicesUrl(opts.publicUrl, club.id),
            stop: await stopLink(trx, { userId: v.id, clubId: club.id, kind: 'shift_digest', publicUrl: opts.publicUrl, clubName: club.name }),
          }));
        return true;
      });
      if (did) sent++;
    }
  }
  if (sent) kickMail(db, mailer);
  return sent;
}

/** The reminder, once, from 24 hours before a shift starts, to everyone holding a place. */
export async function sendShiftReminders(db: Knex, mailer: Mailer, opts: { publicUrl: string; now?: Date }): Promise<number> {
  const now = opts.now ?? new Date();
  let sent = 0;
  for (;;) {
    const did = await db.transaction(async (trx) => {
      const claim = await trx('shift_claims as c')
        .join('shifts as sh', 'sh.id', 'c.shift_id')
        .where('c.status', 'taken')
        .whereNull('c.reminded_at')
        .whereNull('sh.called_off_at')
        .where('sh.starts_at', '>', now)
        .where('sh.starts_at', '<=', new Date(now.getTime() + DAY_MS))
        .forUpdate('c')
        .skipLocked()
        .first('c.id', 'c.user_id', 'c.shift_id');
      if (!claim) return false;
      await trx('shift_claims').where({ id: claim.id }).update({ reminded_at: now });
      const row: ShiftRow = await shiftRows(trx).where('sh.id', claim.shift_id).first();
      // Marked reminded either way, so a person who turned reminders off is not looked at again each minute.
      if (await remindersOff(trx, row.club_id, claim.user_id)) return 'skipped';
      const user = await trx('users').where({ id: claim.user_id }).first('name', 'email');
      const club = await trx('clubs').where({ id: row.club_id }).first('name');
      const release = await makeLink(trx, { shiftId: row.id, userId: claim.user_id, claimId: claim.id, purpose: 'release', expiresAt: new Date(row.starts_at) });
      const done = await makeLink(trx, { shiftId: row.id, userId: claim.user_id, claimId: claim.id, purpose: 'done', expiresAt: doneUntil(row) });
      await enqueueMail(
        trx,
        { clubId: row.club_id, kind: 'shift_reminder' },
        shiftReminderMail({
          to: user.email,
          name: user.name,
          clubName: club.name,
          shift: await wordsFor(trx, row),
          releaseUrl: linkUrl(opts.publicUrl, release),
          doneUrl: linkUrl(opts.publicUrl, done),
          choicesUrl: choicesUrl(opts.publicUrl, row.club_id),
          stop: await stopLink(trx, { userId: claim.user_id, clubId: row.club_id, kind: 'shift_reminder', publicUrl: opts.publicUrl, clubName: club.name }),
        }),
      );
      return 'sent';
    });
    if (!did) break;
    if (did === 'sent') sent++;
  }
  if (sent) kickMail(db, mailer);
  return sent;
}

/** Places still "taken" when their shift has ended become "missed" (a done link can still turn them done). */
export async function markMissedShifts(db: Knex, opts: { now?: Date } = {}): Promise<number> {
  const now = opts.now ?? new Date();
  return db('shift_claims')
    .where('status', 'taken')
    .whereIn('shift_id', db('shifts').where('ends_at', '<=', now).whereNull('called_off_at').select('id'))
    .update({ status: 'missed' });
}

/** A done photo, for the coordinators and the person who sent it. */
export async function shiftPhoto(db: Db, opts: { shiftId: number; claimId: number; viewer: Viewer }): Promise<{ key: string; mime: string }> {
  const claim = await db('shift_claims').where({ id: opts.claimId, shift_id: opts.shiftId }).first('user_id', 'photo_path');
  if (!claim?.photo_path || !/^[0-9a-f]{32}\.webp$/.test(claim.photo_path)) throw notFound('The photo');
  if (claim.user_id !== opts.viewer.userId && !opts.viewer.roles.includes('coordinator')) throw notFound('The photo');
  return { key: shiftPhotoKey(claim.photo_path as string), mime: 'image/webp' };
}
