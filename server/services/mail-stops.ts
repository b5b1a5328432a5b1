import type { Knex } from 'knex';
import { optionalMailKinds, optionalMailWords, type MailStopPreview, type OptionalMailKind } from '@shared/schemas/mail-templates';
import type { Db } from '../db/knex';
import { AppError } from '../errors';
import type { StopLink } from '../mail/layout';
import { hashToken, newToken } from './tokens';

// Stop links of optional mail: one random token per person, club and kind (a new one with each
// message; only the hash is kept). GET says what it stops; POST (the one-click of RFC 8058, or the
// confirm page's button) turns that kind off without signing in, and the link is then used up.

/** The preference topic in `mail_preferences` of the reminder the day before a shift (on until turned off). */
export const SHIFT_REMINDER = 'shift_reminder';

const TOKEN = /^[A-Za-z0-9_-]{43}$/;

/** A fresh stop link for one person, club and kind of optional mail; written in the caller's transaction. */
export async function stopLink(trx: Db, opts: { userId: number; clubId: number; kind: OptionalMailKind; publicUrl: string; clubName: string }): Promise<StopLink> {
  const { token, hash } = newToken();
  await trx('mail_stop_links').insert({ user_id: opts.userId, club_id: opts.clubId, kind: opts.kind, token_hash: hash });
  return stopUrls(opts.publicUrl, token, `${optionalMailWords[opts.kind]} from ${opts.clubName}`);
}

/** The two addresses of a token: the confirm page (people) and the one-click address (List-Unsubscribe). */
export function stopUrls(publicUrl: string, token: string, what: string): StopLink {
  return { what, pageUrl: `${publicUrl}/stop-mail?token=${token}`, oneClickUrl: `${publicUrl}/api/mail-stops/${token}` };
}

interface StopRow {
  id: number;
  user_id: number;
  club_id: number;
  kind: OptionalMailKind;
  used_at: Date | null;
}

const unknownLink = () => new AppError('not_found', 'This stop link is not one of ours. Use the link in the newest e-mail, or change your e-mail choices after signing in.');

async function rowOf(db: Db, token: string, lock = false): Promise<StopRow> {
  if (!TOKEN.test(token)) throw unknownLink();
  let q = db('mail_stop_links').where({ token_hash: hashToken(token) });
  if (lock) q = q.forUpdate();
  const row: StopRow | undefined = await q.first('id', 'user_id', 'club_id', 'kind', 'used_at');
  if (!row || !optionalMailKinds.includes(row.kind)) throw unknownLink();
  return row;
}

async function previewOf(db: Db, row: StopRow): Promise<MailStopPreview> {
  const club = await db('clubs').where({ id: row.club_id }).first('name');
  const user = await db('users').where({ id: row.user_id }).first('name');
  return {
    kind: row.kind,
    what: optionalMailWords[row.kind],
    clubName: club?.name ?? '',
    forName: String(user?.name ?? '').split(/\s+/)[0] ?? '',
    state: row.used_at ? 'used' : 'ready',
  };
}

/** What a stop link would turn off; opening it changes nothing (mail scanners fetch links). */
export async function previewStop(db: Db, token: string): Promise<MailStopPreview> {
  return previewOf(db, await rowOf(db, token));
}

/** Turns one kind of optional mail off for one person in one club. */
export async function turnOff(db: Db, opts: { userId: number; clubId: number; kind: OptionalMailKind }) {
  const { userId, clubId } = opts;
  const topic = async (name: string) =>
    db('mail_preferences')
      .insert({ user_id: userId, club_id: clubId, topic: name, is_subscribed: false })
      .onConflict(['user_id', 'club_id', 'topic'])
      .merge({ is_subscribed: false, updated_at: db.fn.now() });
  // Until a person chooses, the weekly e-mail comes on Mondays and calls for help come (shift-hours.ts).
  const volunteer = async (change: { digest_day?: null; help_mail?: false }) =>
    db('volunteer_settings')
      .insert({ club_id: clubId, user_id: userId, digest_day: 1, help_mail: true, ...change })
      .onConflict(['club_id', 'user_id'])
      .merge({ ...change, updated_at: db.fn.now() });
  switch (opts.kind) {
    case 'club_news':
      return topic('club_news'); // mailings.ts CLUB_NEWS
    case 'shift_reminder':
      return topic(SHIFT_REMINDER);
    case 'shift_digest':
      return volunteer({ digest_day: null });
    case 'shift_help':
      return volunteer({ help_mail: false });
  }
}

/**
 * The one-click (and the confirm page's button): turns the link's kind of mail off and uses the link up.
 * A second use is refused with 410, so a replayed or forwarded link says plainly that it did nothing.
 */
export async function useStop(db: Knex, token: string, now = new Date()): Promise<MailStopPreview> {
  return db.transaction(async (trx) => {
    const row = await rowOf(trx, token, true);
    if (row.used_at) throw new AppError('gone', 'This stop link was already used: that mail is off. You can turn it back on in your e-mail choices.');
    await turnOff(trx, { userId: row.user_id, clubId: row.club_id, kind: row.kind });
    await trx('mail_stop_links').where({ id: row.id }).update({ used_at: now });
    return previewOf(trx, { ...row, used_at: now });
  });
}

/** True when the person turned the reminder the day before a shift off in that club. */
export async function remindersOff(db: Db, clubId: number, userId: number): Promise<boolean> {
  const row = await db('mail_preferences').where({ club_id: clubId, user_id: userId, topic: SHIFT_REMINDER }).first('is_subscribed');
  return row ? !row.is_subscribed : false;
}
