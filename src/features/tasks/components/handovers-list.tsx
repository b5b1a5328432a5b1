import type { PlotTasks } from '@shared/schemas/tasks';
import { Button } from '@/components/ui/button';
import { joinWords } from '@/lib/format';
import { taskWindow, taskWindowWords } from '../lib/dates';
import { kindWords } from '../lib/words';

export interface HandoversListProps {
  handovers: PlotTasks['handovers'];
  today: string;
  canWrite: boolean;
  /** The handover being cancelled, if any. */
  cancelling?: number | null;
  onCancel?: (handoverId: number) => void;
}

/** The periods this plot's tasks are handed to the volunteers, each with the kinds, the note and a Cancel. */
export function HandoversList({ handovers, today, canWrite, cancelling = null, onCancel }: HandoversListProps) {
  if (handovers.length === 0) return null;
  const sorted = [...handovers].sort((a, b) => a.fromOn.localeCompare(b.fromOn) || a.id - b.id);
  return (
    <section aria-labelledby="tasks-handovers" className="rounded-xl border-l-4 border-straw bg-straw-100 p-4">
      <h3 id="tasks-handovers" className="font-semibold">
        Handed to the volunteers
      </h3>
      <ul className="mt-2 flex flex-col gap-3">
        {sorted.map((h) => {
          const when = taskWindow(h.fromOn, h.toOn, today);
          return (
            <li key={h.id} className="flex flex-col gap-2 sm:flex-row sm:items-start sm:justify-between">
              <div className="min-w-0">
                <p className="font-medium">{when}</p>
                <p className="text-sm">{joinWords(h.kinds.map((k) => kindWords[k]))}</p>
                {h.note && <p className="text-sm whitespace-pre-line text-stone">{h.note}</p>}
              </div>
              {canWrite && (
                <Button
                  variant="secondary"
                  className="shrink-0"
                  loading={cancelling === h.id}
                  loadingText="Cancelling…"
                  disabled={cancelling !== null}
                  onClick={() => onCancel?.(h.id)}
                  aria-label={`Cancel the cover for ${taskWindowWords(h.fromOn, h.toOn, today)}`}
                >
                  Cancel
                </Button>
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
