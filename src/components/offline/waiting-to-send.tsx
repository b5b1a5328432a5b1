import { CloudOff, RefreshCw, Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import type { QueuedEntry } from '@/lib/offline/queue';

export interface WaitingToSendProps {
  entries: QueuedEntry[];
  sending: boolean;
  onRetry: () => void;
  onDiscard: (key: string) => void;
}

/**
 * The entries this phone still holds: each says "Waiting to send" (or what the server refused) in words,
 * with a button to send now and, for a refused one, to discard it.
 */
export function WaitingToSend({ entries, sending, onRetry, onDiscard }: WaitingToSendProps) {
  if (entries.length === 0) return null;
  return (
    <section aria-labelledby="waiting-to-send" className="flex flex-col gap-2 rounded-lg border border-stone bg-paper p-3">
      <h2 id="waiting-to-send" className="flex items-center gap-2 font-semibold text-soil">
        <CloudOff className="size-5" aria-hidden="true" />
        Kept on this phone ({entries.length})
      </h2>
      <ul className="flex flex-col gap-2">
        {entries.map((entry) => (
          <li key={entry.key} className="flex flex-col gap-1 text-sm">
            <span className="font-medium text-soil">{entry.label}</span>
            {entry.error ? (
              <>
                <span className="text-clay-700">Not sent: {entry.error} Correct it and save again, or discard it.</span>
                <Button variant="secondary" className="self-start" onClick={() => onDiscard(entry.key)}>
                  <Trash2 className="size-4" aria-hidden="true" />
                  Discard
                </Button>
              </>
            ) : (
              <span>Waiting to send</span>
            )}
          </li>
        ))}
      </ul>
      <Button variant="secondary" className="self-start" onClick={onRetry} loading={sending} loadingText="Sending…">
        <RefreshCw className="size-4" aria-hidden="true" />
        Send now
      </Button>
    </section>
  );
}
