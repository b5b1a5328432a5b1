import { useId, useState } from 'react';
import { Check, Droplets, HandHelping, NotebookPen, TriangleAlert, Undo2 } from 'lucide-react';
import type { UnitSystem } from '@shared/geometry';
import type { TaskView } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { dueWords, taskDate, taskWindow, taskWindowWords } from '../lib/dates';
import { formatWaterAmount } from '../lib/units';
import { statusWords } from '../lib/words';
import { KindTag } from './kind-tag';

/** The words shown when a change met a newer version of the task (409): the list has been read again. */
export const CHANGED_MESSAGE = 'Someone changed this task; here it is now.';

/** What a task item is doing right now, if anything. */
export type TaskBusy = 'done' | 'skip' | 'reopen' | null;

export interface TaskItemProps {
  task: TaskView;
  /** The site's today (from the server), for "Due in 2 days" and whether to name the year. */
  today: string;
  units: UnitSystem;
  /** Whether this person may mark done, not needed and undo. */
  canWrite: boolean;
  busy?: TaskBusy;
  /** A note about the last change, e.g. CHANGED_MESSAGE after a 409. */
  notice?: string | null;
  error?: string | null;
  /** The server's message for the note box, after a 400 on `note`. */
  noteError?: string | null;
  /** Heading level of the task's title, so it fits the page outline. */
  headingLevel?: 'h3' | 'h4';
  /** Show the plot's label (on lists covering more than one plot). */
  showPlot?: boolean;
  onDone?: (note: string) => void;
  onSkip?: () => void;
  onReopen?: () => void;
}

/**
 * One task: its kind (icon and word), title, window in plain dates, the amount for watering, the caution the
 * server sends (never left out), the explanation and its source in small text, and the buttons this person may use.
 */
export function TaskItem({
  task: t,
  today,
  units,
  canWrite,
  busy = null,
  notice,
  error,
  noteError,
  headingLevel: Heading = 'h4',
  showPlot = false,
  onDone,
  onSkip,
  onReopen,
}: TaskItemProps) {
  const ids = useId();
  const [noting, setNoting] = useState(false);
  const [note, setNote] = useState('');
  const titleId = `${ids}-title`;
  const amount = t.kind === 'water' ? formatWaterAmount(t.amountMm, t.amountL, units) : null;
  const open = t.status === 'open';
  const where = [showPlot ? (t.plotLabel ? `Plot ${t.plotLabel}` : 'Whole site') : null, t.cropName].filter(Boolean).join(' · ');

  return (
    <article aria-labelledby={titleId} className="flex flex-col gap-3 rounded-xl border border-paper-200 bg-white p-4">
      <div className="flex flex-wrap items-center gap-2">
        <KindTag kind={t.kind} />
        {!open && <Badge tone={t.status === 'done' ? 'leaf' : 'neutral'}>{statusWords[t.status]}</Badge>}
        {t.forVolunteers && (
          <span className="inline-flex items-center gap-1.5 rounded-full border border-straw bg-straw-100 px-2.5 py-0.5 text-sm font-medium text-soil">
            <HandHelping className="size-4 shrink-0" aria-hidden="true" />
            Volunteers asked to cover
          </span>
        )}
      </div>
      <div>
        <Heading id={titleId} className="text-lg font-semibold break-words">
          {t.title}
        </Heading>
        {where && <p className="text-sm text-stone">{where}</p>}
        <p className="mt-1">
          <span className="sr-only">Window: {taskWindowWords(t.windowFrom, t.windowTo, today)}. </span>
          <span aria-hidden="true">{taskWindow(t.windowFrom, t.windowTo, today)}</span>
          <span className="text-stone">
            {' · '}
            {open ? dueWords(t.dueOn, today) : t.doneOn ? `${statusWords[t.status]} on ${taskDate(t.doneOn, today)}` : statusWords[t.status]}
          </span>
        </p>
        {amount && (
          <p className="mt-1 flex items-center gap-1.5 font-medium">
            <Droplets className="size-4 shrink-0 text-water-700" aria-hidden="true" />
            <span>
              <span className="sr-only">Amount: </span>
              {amount}
            </span>
          </p>
        )}
      </div>
      {t.caution && (
        <Alert tone="warning" announce={false} title="Take care">
          <span className="flex items-start gap-2">
            <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden="true" />
            {t.caution}
          </span>
        </Alert>
      )}
      {(t.details || t.source) && (
        <div className="text-sm text-stone">
          {t.details && <p className="whitespace-pre-line">{t.details}</p>}
          {t.source && <p className={t.details ? 'mt-1' : ''}>Source: {t.source}</p>}
        </div>
      )}
      {notice && (
        <Alert tone="info" announce={false}>
          {notice}
        </Alert>
      )}
      {error && (
        <Alert tone="error" announce={false}>
          {error}
        </Alert>
      )}
      {canWrite && open && (
        <div className="flex flex-col gap-3">
          {noting && (
            <TextAreaField
              label="Note (optional)"
              hint="Kept with the task, e.g. what you used or how it looked."
              rows={2}
              maxLength={500}
              value={note}
              // Opened on purpose by "Add a note": the box takes the focus the button had.
              autoFocus
              error={noteError ?? undefined}
              onChange={(e) => setNote(e.target.value)}
            />
          )}
          <div className="flex flex-wrap items-center gap-3">
            <Button
              className="min-h-12 px-6 text-lg"
              loading={busy === 'done'}
              loadingText="Saving…"
              disabled={busy !== null}
              onClick={() => onDone?.(note)}
              aria-label={`Done: ${t.title}`}
            >
              <Check className="size-5" aria-hidden="true" />
              Done
            </Button>
            <Button
              variant="secondary"
              loading={busy === 'skip'}
              loadingText="Saving…"
              disabled={busy !== null}
              onClick={() => onSkip?.()}
              aria-label={`Not needed: ${t.title}`}
            >
              Not needed
            </Button>
            {!noting && (
              <Button variant="ghost" onClick={() => setNoting(true)} aria-label={`Add a note to ${t.title}`}>
                <NotebookPen className="size-5" aria-hidden="true" />
                Add a note
              </Button>
            )}
          </div>
        </div>
      )}
      {canWrite && !open && (
        <div>
          <Button
            variant="secondary"
            loading={busy === 'reopen'}
            loadingText="Undoing…"
            disabled={busy !== null}
            onClick={() => onReopen?.()}
            aria-label={`Undo: ${t.title}`}
          >
            <Undo2 className="size-5" aria-hidden="true" />
            Undo
          </Button>
        </div>
      )}
    </article>
  );
}
