import { useCallback, useEffect, useState } from 'react';
import { listEntries, onQueueChanged, removeEntry, sendWaiting, type QueuedEntry } from './queue';

/**
 * One page's entries waiting to be sent, for the signed-in person. Sends them when the page opens, when the
 * browser says it is `online` again, and on `retry`; `onSent` runs after any was sent (to read lists again).
 */
export function useOfflineQueue(userId: number, page: string, onSent?: () => void) {
  const [entries, setEntries] = useState<QueuedEntry[]>([]);
  const [sending, setSending] = useState(false);

  const reload = useCallback(() => {
    listEntries(userId, page).then(setEntries, () => setEntries([]));
  }, [userId, page]);

  const retry = useCallback(async () => {
    setSending(true);
    try {
      const outcomes = await sendWaiting(userId, page);
      if (outcomes.includes('sent')) onSent?.();
    } finally {
      setSending(false);
      reload();
    }
  }, [userId, page, onSent, reload]);

  useEffect(() => {
    // After the first render (not inside the effect's own turn): send what is waiting and list what is left.
    const first = window.setTimeout(() => void retry(), 0);
    const off = onQueueChanged(reload);
    const online = () => void retry();
    window.addEventListener('online', online);
    return () => {
      window.clearTimeout(first);
      off();
      window.removeEventListener('online', online);
    };
    // Once per page and person: `retry` changes with `onSent`, which callers need not memoise.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [userId, page]);

  return { entries, sending, retry, discard: (key: string) => removeEntry(key) };
}
