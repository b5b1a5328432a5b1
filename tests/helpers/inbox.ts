import { z } from 'zod';
import { decodeEntities, findHrefs, findUrls } from '../../fake-mail/links';
import {
  MessageListSchema,
  MessageSchema,
  type Message,
  type MessageFilter,
  type MessageSummary,
} from '../../fake-mail/schema';

export type { Message, MessageSummary } from '../../fake-mail/schema';

const POLL_INTERVAL_MS = 100;

export interface WaitForMailOptions {
  to: string;
  subject?: string;
  /** Default 10 000. */
  timeoutMs?: number;
  /**
   * Epoch milliseconds: only messages received at or after this moment count.
   * Take `Date.now()` just before the action that sends the mail.
   */
  after?: number;
}

async function getJson<T>(url: URL, schema: z.ZodType<T>): Promise<T> {
  const res = await fetch(url);
  if (!res.ok) {
    throw new Error(`test inbox: GET ${url.href} answered ${res.status}: ${await res.text()}`);
  }
  return schema.parse(await res.json());
}

function listUrl(baseUrl: string, filter: MessageFilter): URL {
  const url = new URL('/api/messages', baseUrl);
  if (filter.to !== undefined) url.searchParams.set('to', filter.to);
  if (filter.subject !== undefined) url.searchParams.set('subject', filter.subject);
  return url;
}

/** Lists messages in the test inbox, newest first, optionally filtered by recipient and subject substring. */
export async function listMail(baseUrl: string, filter: MessageFilter = {}): Promise<MessageSummary[]> {
  return (await getJson(listUrl(baseUrl, filter), MessageListSchema)).items;
}

/** Fetches one full message by id. */
export async function getMail(baseUrl: string, id: string): Promise<Message> {
  return getJson(new URL(`/api/messages/${encodeURIComponent(id)}`, baseUrl), MessageSchema);
}

/** Polls the inbox until a matching message arrives and returns the newest one; throws when `timeoutMs` passes first. */
export async function waitForMail(baseUrl: string, options: WaitForMailOptions): Promise<Message> {
  const timeoutMs = options.timeoutMs ?? 10_000;
  const deadline = Date.now() + timeoutMs;
  const after = options.after ?? Number.NEGATIVE_INFINITY;
  const filter = { to: options.to, subject: options.subject };

  for (;;) {
    const items = await listMail(baseUrl, filter);
    const found = items.find((item) => Date.parse(item.receivedAt) >= after);
    if (found) return getMail(baseUrl, found.id);
    if (Date.now() >= deadline) break;
    await new Promise((resolve) => setTimeout(resolve, Math.min(POLL_INTERVAL_MS, deadline - Date.now())));
  }

  const wanted = `to ${options.to}${options.subject === undefined ? '' : ` with subject containing "${options.subject}"`}${
    options.after === undefined ? '' : ` received since ${new Date(options.after).toISOString()}`
  }`;
  const recent = (await listMail(baseUrl)).slice(0, 5);
  const seen =
    recent.length === 0
      ? 'The inbox is empty.'
      : `Latest in the inbox:\n${recent
          .map((m) => `  ${m.receivedAt}  to ${m.to.join(', ') || '(none)'}  "${m.subject}"`)
          .join('\n')}`;
  throw new Error(`waitForMail: no message ${wanted} arrived within ${timeoutMs} ms at ${baseUrl}. ${seen}`);
}

/** Deletes every message in the test inbox. */
export async function clearMail(baseUrl: string): Promise<void> {
  const url = new URL('/api/messages', baseUrl);
  const res = await fetch(url, { method: 'DELETE' });
  if (res.status !== 204) {
    throw new Error(`test inbox: DELETE ${url.href} answered ${res.status}: ${await res.text()}`);
  }
}

/** Returns the first URL in the message (text part first, then HTML links) whose path contains `pathFragment`. */
export function extractLink(message: Message, pathFragment: string): string {
  // Matched against the path and query, so "answer=decline" picks one of two links to the same page.
  const html = message.html ?? '';
  const candidates = [...findUrls(message.text), ...findHrefs(html), ...findUrls(decodeEntities(html))];
  for (const candidate of candidates) {
    let url: URL;
    try {
      url = new URL(candidate);
    } catch {
      continue;
    }
    if ((url.protocol === 'http:' || url.protocol === 'https:') && (url.pathname + url.search).includes(pathFragment)) {
      return candidate;
    }
  }
  throw new Error(
    `extractLink: no link whose path contains "${pathFragment}" in "${message.subject}" to ${message.to.join(', ')}. Text was:\n${message.text || '(empty)'}`,
  );
}
