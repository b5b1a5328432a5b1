import type { WaitlistEntry } from '@shared/schemas/applications';
import { waitlistMoveKindLabels } from '@shared/schemas/waitlist';
import { Dialog } from '@/components/ui/dialog';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { LocalDate } from '@/lib/time-zone';
import { useApplicationHistory } from '../api/get-application-history';

function HistoryList({ entry }: { entry: WaitlistEntry }) {
  const history = useApplicationHistory(entry.id, true);
  if (history.isPending) return <LoadingState label="Loading history…" />;
  if (history.isError) return <ErrorState message={history.error.message} onRetry={() => void history.refetch()} />;
  return (
    <ol className="flex flex-col gap-3">
      <li className="rounded-lg border border-paper-200 p-3">
        <p className="font-medium">Applied</p>
        <p className="text-sm text-stone"><LocalDate value={entry.appliedAt} /></p>
      </li>
      {history.data.items.map((move) => (
        <li key={move.id} className="rounded-lg border border-paper-200 p-3">
          <p className="font-medium">
            {waitlistMoveKindLabels[move.kind] ?? move.kind}
            {move.fromPosition !== null && move.toPosition !== null && `: from ${move.fromPosition} to ${move.toPosition}`}
            {move.fromPosition !== null && move.toPosition === null && ` (was number ${move.fromPosition})`}
          </p>
          <p className="mt-1">{move.reason}</p>
          <p className="mt-1 text-sm text-stone">
            <LocalDate value={move.createdAt} />
            {move.byName && ` · ${move.byName}`}
          </p>
        </li>
      ))}
    </ol>
  );
}

/** Every recorded change to one person's place, oldest first. */
export function HistoryDialog({ entry, onClose }: { entry: WaitlistEntry | null; onClose: () => void }) {
  return (
    <Dialog open={entry !== null} onClose={onClose} title={entry ? `History of ${entry.name}` : 'History'}>
      {entry && <HistoryList entry={entry} />}
    </Dialog>
  );
}
