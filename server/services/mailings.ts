import type { Knex } from 'knex';
import type {
  Mailing,
  MailingAudience,
  MailingAudienceCount,
  MailingCreateBody,
  MailingSent,
  MailPreferences,
} from '@shared/schemas/mailings';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import type { Mailer } from '../mail/mailer';
import { clubNewsMail } from '../mail/mailing-templates';
import { stopLink } from './mail-stops';
import { enqueueMail, kickMail } from './outbox';

/** The one optional topic; offers, renewals, receipts and resets are required and never look here. */
export const CLUB_NEWS = 'club_news';

interface Recipient {
  id: number;
  name: string;
  email: string;
  opted_out: boolean;
}

/** The people an audience selects in a club, each once, by name, with whether they turned club news off. */
async function audiencePeople(db: Db, clubId: number, audience: MailingAudience): Promise<Recipient[]> {
  const q =
    audience.kind === 'all_members'
      ? db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('m.club_id', clubId)
      : db('allocations as a')
          .join('seasons as se', 'se.id', 'a.season_id')
          .join('users as u', 'u.id', 'a.user_id')
          .where({ 'se.club_id': clubId, 'se.year': audience.year, 'a.status': 'active' });
  if (audience.kind === 'site') q.join('plots as p', 'p.id', 'a.plot_id').where('p.site_id', audience.siteId);
  return q
    .leftJoin('mail_preferences as mp', (j) =>
      j.on('mp.user_id', 'u.id').andOn('mp.club_id', db.raw('?', [clubId])).andOn('mp.topic', db.raw('?', [CLUB_NEWS])),
    )
    .distinct('u.id', 'u.name', 'u.email', db.raw('coalesce(mp.is_subscribed = false, false) as opted_out'))
    .orderBy('u.name')
    .orderBy('u.id');
}

async function siteName(db: Db, clubId: number, siteId: number): Promise<string | null> {
  const site = await db('sites').where({ id: siteId, club_id: clubId }).first('name');
  return site ? site.name : null;
}

/** Says who an audience is, for the sent list; the footer says the same to each person in their own words. */
function audienceWords(audience: MailingAudience, clubName: string, site: string | null) {
  switch (audience.kind) {
    case 'all_members':
      return { label: 'Everyone in the club', because: `you are a member of ${clubName}` };
    case 'season':
      return { label: `Plot holders in ${audience.year}`, because: `you hold a plot at ${clubName} in ${audience.year}` };
    case 'site':
      return {
        label: `Plot holders at ${site ?? 'a removed site'} in ${audience.year}`,
        because: `you hold a plot at ${site ?? 'a site'} (${clubName}) in ${audience.year}`,
      };
  }
}

/** How many people a message to `audience` would go to now (the confirm step says it before sending). */
export async function countAudience(db: Db, clubId: number, audience: MailingAudience): Promise<MailingAudienceCount> {
  if (audience.kind === 'site' && !(await siteName(db, clubId, audience.siteId))) {
    throw new AppError('validation_failed', 'Some fields need attention.', { siteId: "Choose one of the club's sites" });
  }
  const people = await audiencePeople(db, clubId, audience);
  const recipients = people.filter((p) => !p.opted_out).length;
  return { recipients, skipped: people.length - recipients };
}

/**
 * Sends a club message to each person in the audience as their own e-mail, skipping people who
 * turned club news off, and records the mailing with how many it was for. The mailing and every
 * e-mail are written in one transaction (the outbox sends them, retrying), so `sent` counts the
 * messages handed to the outbox; the sent list counts those delivered, and the outgoing-mail page
 * shows any that could not be.
 */
export async function sendMailing(
  db: Knex,
  mailer: Mailer,
  opts: { clubId: number; userId: number; body: MailingCreateBody; publicUrl: string },
): Promise<MailingSent> {
  const { clubId, body } = opts;
  const club = await db('clubs').where({ id: clubId }).first('name');
  if (!club) throw notFound('The club');
  const sender = await db('users').where({ id: opts.userId }).first('name');
  let site: string | null = null;
  if (body.audience.kind === 'site') {
    site = await siteName(db, clubId, body.audience.siteId);
    if (!site) {
      throw new AppError('validation_failed', 'Some fields need attention.', { 'audience.siteId': "Choose one of the club's sites" });
    }
  }
  const people = await audiencePeople(db, clubId, body.audience);
  const recipients = people.filter((p) => !p.opted_out);
  const { because } = audienceWords(body.audience, club.name, site);
  const preferencesUrl = `${opts.publicUrl}/clubs/${clubId}/email-choices`;
  // One message per person: nobody sees anyone else's address, and one bad address stops nobody else's mail.
  const row = await db.transaction(async (trx) => {
    const [inserted] = await trx('mailings')
      .insert({
        club_id: clubId,
        subject: body.subject,
        body: body.body,
        audience: JSON.stringify(body.audience),
        recipient_count: recipients.length,
        sent_count: recipients.length,
        sent_by_user_id: opts.userId,
      })
      .returning('id');
    for (const p of recipients) {
      const fromName = `${sender.name} (${club.name})`;
      await enqueueMail(trx, { clubId, kind: 'club_news', mailingId: inserted.id, fromName }, clubNewsMail({
        to: p.email,
        name: p.name,
        clubName: club.name,
        senderName: sender.name,
        subject: body.subject,
        body: body.body,
        because,
        preferencesUrl,
        stop: await stopLink(trx, { userId: p.id, clubId, kind: 'club_news', publicUrl: opts.publicUrl, clubName: club.name }),
      }));
    }
    return inserted;
  });
  kickMail(db, mailer);
  const sent = recipients.length;
  return { id: row.id, recipients: recipients.length, sent, skipped: people.length - recipients.length };
}

/** The club's past messages, newest first. */
export async function listMailings(db: Db, clubId: number) {
  const club = await db('clubs').where({ id: clubId }).first('name');
  const rows = await db('mailings as m')
    .leftJoin('users as u', 'u.id', 'm.sent_by_user_id')
    .where('m.club_id', clubId)
    .orderBy('m.created_at', 'desc')
    .orderBy('m.id', 'desc')
    .select(
      'm.*',
      'u.name as sent_by_name',
      // Delivered copies from the outbox; a message from before the outbox keeps its recorded count.
      db.raw(
        `coalesce((select count(*) filter (where o.status = 'sent') from mail_outbox o where o.mailing_id = m.id having count(*) > 0), m.sent_count) as delivered`,
      ),
    );
  const siteIds = [...new Set(rows.map((r) => (r.audience as MailingAudience)).flatMap((a) => (a.kind === 'site' ? [a.siteId] : [])))];
  const sites = new Map<number, string>(
    siteIds.length ? (await db('sites').whereIn('id', siteIds).select('id', 'name')).map((s) => [s.id, s.name]) : [],
  );
  const items: Mailing[] = rows.map((r) => {
    const audience = r.audience as MailingAudience;
    const site = audience.kind === 'site' ? (sites.get(audience.siteId) ?? null) : null;
    return {
      id: r.id,
      subject: r.subject,
      body: r.body,
      audience,
      audienceLabel: audienceWords(audience, club?.name ?? '', site).label,
      recipientCount: r.recipient_count,
      sentCount: Number(r.delivered),
      sentByName: r.sent_by_name,
      createdAt: new Date(r.created_at).toISOString(),
    };
  });
  return { items, page: 1, total: items.length };
}

/** A person's optional e-mail choices in a club; club news is on until they turn it off. */
export async function getMailPreferences(db: Db, clubId: number, userId: number): Promise<MailPreferences> {
  const row = await db('mail_preferences').where({ club_id: clubId, user_id: userId, topic: CLUB_NEWS }).first('is_subscribed');
  return { clubNews: row ? row.is_subscribed : true };
}

/** Saves a person's optional e-mail choices in a club. */
export async function setMailPreferences(db: Db, clubId: number, userId: number, prefs: MailPreferences): Promise<MailPreferences> {
  await db('mail_preferences')
    .insert({ club_id: clubId, user_id: userId, topic: CLUB_NEWS, is_subscribed: prefs.clubNews })
    .onConflict(['user_id', 'club_id', 'topic'])
    .merge({ is_subscribed: prefs.clubNews, updated_at: db.fn.now() });
  return getMailPreferences(db, clubId, userId);
}
