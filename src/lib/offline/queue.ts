import { apiFetch, isApiError } from '@/lib/api/client';

/**
 * Entries made with no connection, kept in this browser's IndexedDB until they are sent. Each carries the
 * Idempotency-Key made when the person pressed save, so sending it again (a lost reply, two tabs, a retry)
 * never records it twice. Only the pages that queue import this (their lazy chunks), never the first page.
 */
export interface QueuedEntry {
  /** The Idempotency-Key: a random UUID made on save. */
  key: string;
  /** Which page's list shows it: 'rain-gauge', 'task-done', 'shift-done', 'plot-book'. */
  page: string;
  /** The signed-in person who made it: a queue is never sent under someone else's session. */
  userId: number;
  method: 'POST' | 'PUT';
  path: string;
  body: unknown;
  /** What the page shows, in the person's words ("2 mm on Tue 1 Dec"). */
  label: string;
  createdAt: string;
  /** The server's message when it refused the entry (4xx): kept for the person to fix or discard. */
  error?: string;
}

const DB = 'tillwell-offline';
const STORE = 'entries';
const CHANGED = 'tillwell-queue-changed';

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB, 1);
    request.onupgradeneeded = () => request.result.createObjectStore(STORE, { keyPath: 'key' });
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error ?? new Error('IndexedDB did not open'));
  });
}

async function run<T>(mode: IDBTransactionMode, act: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await open();
  try {
    return await new Promise<T>((resolve, reject) => {
      const tx = db.transaction(STORE, mode);
      const request = act(tx.objectStore(STORE));
      tx.oncomplete = () => resolve(request.result);
      tx.onerror = () => reject(tx.error ?? new Error('IndexedDB write failed'));
    });
  } finally {
    db.close();
  }
}

const changed = () => window.dispatchEvent(new Event(CHANGED));

export async function putEntry(entry: QueuedEntry): Promise<void> {
  await run('readwrite', (s) => s.put(entry));
  changed();
}

export async function removeEntry(key: string): Promise<void> {
  await run('readwrite', (s) => s.delete(key));
  changed();
}

export async function listEntries(userId: number, page?: string): Promise<QueuedEntry[]> {
  const all = await run('readonly', (s) => s.getAll() as IDBRequest<QueuedEntry[]>);
  return all.filter((e) => e.userId === userId && (page === undefined || e.page === page)).sort((a, b) => a.createdAt.localeCompare(b.createdAt));
}

export function onQueueChanged(listener: () => void): () => void {
  window.addEventListener(CHANGED, listener);
  return () => window.removeEventListener(CHANGED, listener);
}

/** A failure that means "not sent": no network (status 0) or a server that could not answer (5xx, 429). */
export function isNotSent(error: unknown): boolean {
  return isApiError(error) && (error.status === 0 || error.status >= 500 || error.status === 429);
}

export type SendOutcome = 'sent' | 'waiting' | 'refused';

let sending: Promise<unknown> = Promise.resolve();

/**
 * Sends one entry with its key. Sent: removed. Still no connection: kept as it is. Refused (4xx): kept
 * with the server's message. One at a time in this tab, so two triggers (online and a retry) do not race;
 * the key makes a race with another tab harmless too.
 */
export function sendEntry(entry: QueuedEntry): Promise<SendOutcome> {
  const next = sending.then(async (): Promise<SendOutcome> => {
    try {
      await apiFetch(entry.path, { method: entry.method, body: entry.body, idempotencyKey: entry.key });
      await removeEntry(entry.key);
      return 'sent';
    } catch (error) {
      if (isNotSent(error) || !isApiError(error)) return 'waiting';
      await putEntry({ ...entry, error: error.message });
      return 'refused';
    }
  });
  sending = next.catch(() => undefined);
  return next;
}

/** Sends every entry of the person's that has not been refused (refused ones wait for the person). */
export async function sendWaiting(userId: number, page?: string): Promise<SendOutcome[]> {
  const entries = (await listEntries(userId, page)).filter((e) => !e.error);
  const outcomes: SendOutcome[] = [];
  for (const entry of entries) {
    const outcome = await sendEntry(entry);
    outcomes.push(outcome);
    if (outcome === 'waiting') break; // still offline: the rest would fail the same way
  }
  return outcomes;
}

/** The request never reached the server: the one failure a page turns into a queued entry. */
export const isOffline = (error: unknown) => isApiError(error) && error.status === 0;
