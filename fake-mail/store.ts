import { randomBytes } from 'node:crypto';
import { mkdir, readFile, readdir, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { MessageSchema, type Message, type MessageFilter, type MessageSummary } from './schema';

const FILE_PATTERN = /^[0-9a-z]{18}\.json$/;

let lastMs = 0;
let seq = 0;

/** Makes an id that sorts by arrival time: base-36 milliseconds, a per-millisecond counter, then random bytes. */
export function newMessageId(now: number = Date.now()): string {
  // A clock that steps back must not produce ids that sort before earlier ones.
  if (now <= lastMs) {
    seq += 1;
  } else {
    lastMs = now;
    seq = 0;
  }
  return (
    lastMs.toString(36).padStart(9, '0') +
    seq.toString(36).padStart(3, '0') +
    randomBytes(3).toString('hex')
  );
}

/** True when the message was addressed to `address` (To, Cc or SMTP envelope) and its subject contains `subject`. */
export function matchesFilter(message: Message, filter: MessageFilter): boolean {
  if (filter.to) {
    const wanted = filter.to.trim().toLowerCase();
    const recipients = [...message.to, ...message.cc, ...message.envelope.to];
    if (!recipients.some((address) => address.toLowerCase() === wanted)) return false;
  }
  if (filter.subject && !message.subject.toLowerCase().includes(filter.subject.toLowerCase())) {
    return false;
  }
  return true;
}

/** Cuts a stored message down to its list form. */
export function toSummary(message: Message): MessageSummary {
  const { id, from, to, subject, date, receivedAt } = message;
  return { id, from, to, subject, date, receivedAt };
}

export interface MailStore {
  /** Matching messages, newest first. */
  list(filter?: MessageFilter): Message[];
  get(id: string): Message | undefined;
  add(message: Message): Promise<void>;
  clear(): Promise<void>;
}

/** Opens (and creates if missing) a folder of one-JSON-file-per-message and keeps an index in memory. */
export async function openMailStore(dir: string): Promise<MailStore> {
  await mkdir(dir, { recursive: true });
  const byId = new Map<string, Message>();

  for (const name of await readdir(dir)) {
    if (!FILE_PATTERN.test(name)) continue;
    try {
      const parsed = MessageSchema.safeParse(JSON.parse(await readFile(path.join(dir, name), 'utf8')));
      if (parsed.success) byId.set(parsed.data.id, parsed.data);
      else console.warn(`[fake-mail] skipping ${name}: not a stored message`);
    } catch (err) {
      console.warn(`[fake-mail] skipping ${name}: ${(err as Error).message}`);
    }
  }

  return {
    list(filter = {}) {
      return [...byId.values()]
        .filter((message) => matchesFilter(message, filter))
        .sort((a, b) => (a.id < b.id ? 1 : a.id > b.id ? -1 : 0));
    },
    get(id) {
      return byId.get(id);
    },
    async add(message) {
      const file = path.join(dir, `${message.id}.json`);
      // Write then rename so a crash never leaves half a file that fails to load next time.
      await writeFile(`${file}.tmp`, JSON.stringify(message, null, 2));
      await rename(`${file}.tmp`, file);
      byId.set(message.id, message);
    },
    async clear() {
      byId.clear();
      for (const name of await readdir(dir)) {
        if (FILE_PATTERN.test(name)) await rm(path.join(dir, name), { force: true });
      }
    },
  };
}
