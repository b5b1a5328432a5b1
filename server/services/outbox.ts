import type { Knex } from 'knex';
import type { MailKind, OutboxList, OutboxMessage, OutboxQuery, OutboxStatus } from '@shared/schemas/outbox';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import type { MailAttachment, Mailer, OutgoingMail } from '../mail/mailer';
import { isSealed, openText, sealText } from '../mail/seal';

/**
 * The one rule for e-mail: a message is rendered and written to `mail_outbox` in the same
 * transaction as the change that causes it; `sendDueMail` sends it later, with retries.
 */

/** Tries before a message is marked failed; waits between them double from a minute (1, 2, 4 … 64). */
export const MAX_ATTEMPTS = 8;
const MINUTE = 60 * 1000;
const PAGE_SIZE = 50;

/** How long to wait after the `attempts`-th failed try before the next one. */
export function retryDelayMs(attempts: number): number {
  return 2 ** Math.max(0, attempts - 1) * MINUTE;
}

export interface MailCause {
  /** The club whose coordinators may see and resend it; null for account mail (password links). */
  clubId: number | null;
  kind: MailKind;
  /** The club message this is one copy of. */
  mailingId?: number;
  /** The display name to send under; a club's mail defaults to the club's name. */
  fromName?: string;
}

/**
 * Writes a message, already rendered, to the outbox inside the caller's transaction; nothing is
 * sent yet. Call `kickMail` after the commit so it goes out at once.
 */
export async function enqueueMail(trx: Db, cause: MailCause, rendered: OutgoingMail | Promise<OutgoingMail>): Promise<number> {
  const message = await rendered;
  // A club's mail comes under its name and is answered at its contact address, when it has one.
  const club = cause.clubId === null ? undefined : await trx('clubs').where({ id: cause.clubId }).first('name', 'contact_email');
  const headers = { ...(club?.contact_email ? { 'Reply-To': club.contact_email as string } : {}), ...message.headers };
  const [row] = await trx('mail_outbox')
    .insert({
      club_id: cause.clubId,
      kind: cause.kind,
      mailing_id: cause.mailingId ?? null,
      to_address: message.to,
      subject: message.subject,
      // Bodies and attachments carry live links: sealed, so the table holds no working token.
      html: sealText(message.html),
      text: sealText(message.text),
      // Headers too: an optional mail's List-Unsubscribe carries its stop link's token.
      headers: JSON.stringify(sealText(JSON.stringify(headers))),
      attachments: message.attachments?.length ? JSON.stringify(sealText(JSON.stringify(message.attachments))) : null,
      from_name: cause.fromName ?? message.fromName ?? club?.name ?? null,
      // The server's clock, like the sender's `now`, so a kick right after the commit finds it due.
      next_attempt_at: new Date(),
    })
    .returning('id');
  return row.id;
}

/** A stored row's message as it is sent: sealed bodies opened (rows written before sealing are plain). */
export function openedMail(row: { to_address: string; subject: string; text: string; html: string; headers: unknown; from_name: string | null; attachments: unknown }): OutgoingMail {
  const open = (v: string) => (isSealed(v) ? openText(v) : v);
  const attachments = isSealed(row.attachments) ? (JSON.parse(openText(row.attachments)) as MailAttachment[]) : (row.attachments as MailAttachment[] | null);
  return { to: row.to_address, subject: row.subject, text: open(row.text), html: open(row.html), headers: isSealed(row.headers) ? (JSON.parse(openText(row.headers)) as Record<string, string>) : (row.headers as Record<string, string>), fromName: row.from_name, attachments };
}

function errorText(err: unknown): string {
  const text = err instanceof Error ? err.message : String(err);
  return text.slice(0, 500) || 'Unknown error';
}

/**
 * Sends every waiting message that is due at `now`, one at a time, each claimed with
 * FOR UPDATE SKIP LOCKED so two senders never send one message twice at once. A failure
 * counts an attempt and waits (1, 2, 4 … minutes); after MAX_ATTEMPTS the message is failed.
 * A crash between sending and marking sends that one message again later (at least once).
 */
export async function sendDueMail(db: Knex, mailer: Mailer, now: Date, limit = 500) {
  const done = { sent: 0, retrying: 0, failed: 0 };
  for (let i = 0; i < limit; i++) {
    const outcome = await db.transaction(async (trx) => {
      const row = await trx('mail_outbox')
        .where('status', 'waiting')
        .where('next_attempt_at', '<=', now)
        .orderBy('next_attempt_at')
        .orderBy('id')
        .forUpdate()
        .skipLocked()
        .first();
      if (!row) return null;
      const attempts = row.attempts + 1;
      try {
        await mailer.send(openedMail(row));
      } catch (err) {
        const failed = attempts >= MAX_ATTEMPTS;
        await trx('mail_outbox')
          .where({ id: row.id })
          .update({
            attempts,
            last_error: errorText(err),
            status: failed ? 'failed' : 'waiting',
            next_attempt_at: failed ? now : new Date(now.getTime() + retryDelayMs(attempts)),
          });
        return failed ? 'failed' : 'retrying';
      }
      await trx('mail_outbox').where({ id: row.id }).update({ attempts, status: 'sent', sent_at: now, last_error: null });
      return 'sent';
    });
    if (!outcome) break;
    done[outcome]++;
  }
  return done;
}

interface Run {
  db: Knex;
  again: boolean;
  promise: Promise<void>;
}
const runs = new Map<Mailer, Run>();

/**
 * Sends what is due now in the background, right after a commit, so a reset link or an invitation
 * does not wait for the minute job. Kicks that come while a run is busy make it look once more.
 */
export function kickMail(db: Knex, mailer: Mailer): void {
  const busy = runs.get(mailer);
  if (busy) {
    busy.again = true;
    return;
  }
  const run: Run = { db, again: true, promise: Promise.resolve() };
  run.promise = (async () => {
    try {
      while (run.again) {
        run.again = false;
        await sendDueMail(run.db, mailer, new Date());
      }
    } catch (err) {
      // Rows stay waiting; the minute job tries them again.
      console.warn('outbox: sending after commit stopped:', errorText(err));
    } finally {
      runs.delete(mailer);
    }
  })();
  runs.set(mailer, run);
}

/** Resolves when no kicked run is busy (tests wait for it before cleaning up the database). */
export async function mailIdle(): Promise<void> {
  while (runs.size > 0) await Promise.all([...runs.values()].map((r) => r.promise));
}

interface OutboxRow {
  id: number;
  kind: MailKind;
  to_address: string;
  subject: string;
  status: OutboxStatus;
  attempts: number;
  last_error: string | null;
  next_attempt_at: Date;
  created_at: Date;
  sent_at: Date | null;
}

function toMessage(r: OutboxRow): OutboxMessage {
  return {
    id: r.id,
    kind: r.kind,
    to: r.to_address,
    subject: r.subject,
    status: r.status,
    attempts: r.attempts,
    lastError: r.last_error,
    nextAttemptAt: r.next_attempt_at.toISOString(),
    createdAt: r.created_at.toISOString(),
    sentAt: r.sent_at ? r.sent_at.toISOString() : null,
  };
}

const listColumns = ['id', 'kind', 'to_address', 'subject', 'status', 'attempts', 'last_error', 'next_attempt_at', 'created_at', 'sent_at'];

/** A club's outgoing mail: failed first, then waiting, then sent, newest first within each. */
export async function listOutbox(db: Db, clubId: number, query: OutboxQuery): Promise<OutboxList> {
  const base = () => {
    const q = db('mail_outbox').where({ club_id: clubId });
    if (query.status !== 'all') q.where('status', query.status);
    return q;
  };
  const rows: OutboxRow[] = await base()
    .orderByRaw(`case status when 'failed' then 0 when 'waiting' then 1 else 2 end`)
    .orderBy('created_at', 'desc')
    .orderBy('id', 'desc')
    .limit(PAGE_SIZE)
    .offset((query.page - 1) * PAGE_SIZE)
    .select(listColumns);
  const [{ n }] = await base().count({ n: '*' });
  const [{ f }] = await db('mail_outbox').where({ club_id: clubId, status: 'failed' }).count({ f: '*' });
  return { items: rows.map(toMessage), page: query.page, total: Number(n), failed: Number(f) };
}

/** Puts a failed message back in the queue with fresh tries and sends it straight away. */
export async function resendMail(db: Knex, mailer: Mailer, opts: { clubId: number; messageId: number; now?: Date }): Promise<OutboxMessage> {
  const row = await db.transaction(async (trx) => {
    const found = await trx('mail_outbox').where({ id: opts.messageId, club_id: opts.clubId }).forUpdate().first('id', 'status');
    if (!found) throw notFound('The message');
    if (found.status !== 'failed') {
      throw new AppError('conflict', found.status === 'sent' ? 'This message has already been sent.' : 'This message is already waiting to be sent.');
    }
    const [updated] = await trx('mail_outbox')
      .where({ id: found.id })
      .update({ status: 'waiting', attempts: 0, next_attempt_at: opts.now ?? new Date() })
      .returning(listColumns);
    return updated as OutboxRow;
  });
  kickMail(db, mailer);
  return toMessage(row);
}
