import icalTimezones from '@touch4it/ical-timezones';
import ical, { ICalCalendarMethod } from 'ical-generator';
import { DateTime } from 'luxon';
import type { Knex } from 'knex';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import { hashToken, newToken } from './tokens';

// Shifts as iCalendar (RFC 5545): the file sent when a place is taken, a person's own feed of the
// shifts they hold, and a coordinator's feed of all the club's shifts, at secret addresses whose
// hashes alone are kept. Times are written in the site's zone with its VTIMEZONE block.

export interface CalendarShift {
  id: number;
  title: string;
  siteName: string;
  startsAt: Date;
  endsAt: Date;
  timeZone: string;
  instructions: string;
  caution: string;
  url: string;
  calledOff: boolean;
}

/** A calendar of shifts; `method` PUBLISH for both the attachment and the feeds (nothing to answer). */
export function shiftCalendar(name: string, shifts: CalendarShift[], host: string): string {
  const cal = ical({ name, prodId: { company: 'Tillwell', product: 'Shifts', language: 'EN' }, method: ICalCalendarMethod.PUBLISH });
  const zones = [...new Set(shifts.map((s) => s.timeZone))];
  // One VTIMEZONE per zone used, so calendars place the times right across daylight-saving changes.
  cal.timezone({ name: zones[0] ?? 'UTC', generator: (tz: string) => icalTimezones.getVtimezoneComponent(tz) });
  for (const s of shifts) {
    cal.createEvent({
      id: `shift-${s.id}@${host}`,
      start: DateTime.fromJSDate(s.startsAt, { zone: s.timeZone }),
      end: DateTime.fromJSDate(s.endsAt, { zone: s.timeZone }),
      timezone: s.timeZone,
      summary: s.calledOff ? `Called off: ${s.title}` : s.title,
      location: s.siteName,
      description: [s.instructions, `Take care: ${s.caution}`].filter(Boolean).join('\n\n'),
      url: s.url,
    });
  }
  return cal.toString();
}

export type FeedKind = 'personal' | 'club';

/** Makes a new secret address for a feed; any earlier one of the same person, club and kind stops working. */
export async function resetFeed(db: Knex, opts: { clubId: number; userId: number; kind: FeedKind; publicUrl: string }) {
  const { token, hash } = newToken();
  const [row] = await db('calendar_feeds')
    .insert({ club_id: opts.clubId, user_id: opts.userId, kind: opts.kind, token_hash: hash })
    .onConflict(['club_id', 'user_id', 'kind'])
    .merge({ token_hash: hash, created_at: db.fn.now() })
    .returning('created_at');
  return { url: `${opts.publicUrl}/api/feeds/${token}.ics`, kind: opts.kind, createdAt: new Date(row.created_at).toISOString() };
}

/** Which feeds a person has made in a club (the addresses themselves are not kept). */
export async function feedStatus(db: Db, opts: { clubId: number; userId: number }) {
  const rows = await db('calendar_feeds').where({ club_id: opts.clubId, user_id: opts.userId }).select('kind', 'created_at');
  const of = (k: FeedKind) => {
    const r = rows.find((x: { kind: string }) => x.kind === k);
    return r ? { createdAt: new Date(r.created_at).toISOString() } : null;
  };
  return { personal: of('personal'), club: of('club') };
}

/** The feed behind a secret address, or 404; a club feed stops when its owner is no longer a coordinator. */
export async function feedByToken(db: Db, token: string): Promise<{ clubId: number; userId: number; kind: FeedKind }> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) throw new AppError('not_found', 'That calendar address was not found.');
  const row = await db('calendar_feeds').where({ token_hash: hashToken(token) }).first('club_id', 'user_id', 'kind');
  if (!row) throw notFound('That calendar address');
  const roles = await db('memberships').where({ club_id: row.club_id, user_id: row.user_id }).pluck('role');
  if (!roles.length || (row.kind === 'club' && !roles.includes('coordinator'))) throw notFound('That calendar address');
  return { clubId: row.club_id, userId: row.user_id, kind: row.kind };
}
