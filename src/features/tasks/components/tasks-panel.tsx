import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { WaitingToSend } from '@/components/offline/waiting-to-send';
import { isOffline, putEntry } from '@/lib/offline/queue';
import { useOfflineQueue } from '@/lib/offline/use-offline-queue';
import { Link, useLocation } from 'react-router-dom';
import { ChevronDown, Droplets, Luggage } from 'lucide-react';
import type { PlotTasks, TaskView } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { plural } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useDeleteHandover } from '../api/delete-handover';
import { usePlotTasks } from '../api/get-plot-tasks';
import { invalidateTaskLists } from '../api/invalidate';
import { useMarkTaskDone } from '../api/mark-task-done';
import { taskStatusBody } from '../api/task-status';
import { useReopenTask } from '../api/reopen-task';
import { useSkipTask } from '../api/skip-task';
import { taskWindow } from '../lib/dates';
import { nothingToDo, taskGroups, type TaskGroup } from '../lib/groups';
import { HandoverDialog } from './handover-dialog';
import { HandoversList } from './handovers-list';
import { CHANGED_MESSAGE, TaskItem, type TaskBusy } from './task-item';

export interface TasksPanelProps {
  clubId: number;
  plotId: number;
  plotLabel: string;
  siteId: number;
  siteName: string;
  /** The signed-in person: a Done pressed with no connection is kept on the phone for them only. */
  userId?: number;
}

/** The id the plot book gives the panel's heading; the home page's "This week" links to it. */
export const TASKS_ANCHOR = 'tasks';

interface Feedback {
  notice?: string;
  error?: string;
  noteError?: string;
}

function GroupList({
  group,
  data,
  busyOf,
  feedback,
  actions,
}: {
  group: TaskGroup;
  data: PlotTasks;
  busyOf: (t: TaskView) => TaskBusy;
  feedback: Record<number, Feedback>;
  actions: { done: (t: TaskView, note: string) => void; skip: (t: TaskView) => void; reopen: (t: TaskView) => void };
}) {
  return (
    <ul className="flex flex-col gap-3">
      {group.tasks.map((t) => (
        <li key={t.id}>
          <TaskItem
            task={t}
            today={data.today}
            units={data.units}
            canWrite={data.canWrite}
            busy={busyOf(t)}
            notice={feedback[t.id]?.notice}
            error={feedback[t.id]?.error}
            noteError={feedback[t.id]?.noteError}
            onDone={(note) => actions.done(t, note)}
            onSkip={() => actions.skip(t)}
            onReopen={() => actions.reopen(t)}
          />
        </li>
      ))}
    </ul>
  );
}

/**
 * The plot book's Tasks: Overdue, This week, Next week, Later (folded) and Recently done, with Done, Not needed and
 * Undo for those who may write the book, and the periods handed to the volunteers. A change that meets a newer
 * version of the task says so beside it and shows the task as it is now.
 */
export function TasksPanel({ clubId, plotId, plotLabel, siteId, siteName, userId }: TasksPanelProps) {
  const tasks = usePlotTasks(plotId);
  const queryClient = useQueryClient();
  const refresh = useCallback(() => void invalidateTaskLists(queryClient), [queryClient]);
  const queue = useOfflineQueue(userId ?? 0, `task-done:${plotId}`, refresh);
  const done = useMarkTaskDone();
  const skip = useSkipTask();
  const reopen = useReopenTask();
  const cancelHandover = useDeleteHandover();
  const [feedback, setFeedback] = useState<Record<number, Feedback>>({});
  const [status, setStatus] = useState<string | null>(null);
  const [handoverError, setHandoverError] = useState<string | null>(null);
  const [away, setAway] = useState(false);
  const [openLater, setOpenLater] = useState(false);
  const statusRef = useRef<HTMLDivElement>(null);
  const { hash } = useLocation();
  const loaded = tasks.isSuccess;

  // The home page links to #tasks; the plot book draws it only once loaded, so the browser's own jump misses it.
  useEffect(() => {
    if (loaded && hash === `#${TASKS_ANCHOR}`) document.getElementById(TASKS_ANCHOR)?.scrollIntoView({ block: 'start' });
  }, [loaded, hash]);

  if (tasks.isPending) return <LoadingState label="Loading the tasks…" />;
  if (tasks.isError) {
    return (
      <ErrorState
        title="The tasks could not be loaded"
        message={tasks.error.message}
        requestId={isApiError(tasks.error) ? tasks.error.requestId : undefined}
        onRetry={() => void tasks.refetch()}
        retrying={tasks.isFetching}
      />
    );
  }

  const data = tasks.data;
  const groups = taskGroups(data);

  const say = (taskId: number, f: Feedback) => setFeedback((all) => ({ ...all, [taskId]: f }));
  const onError = (t: TaskView) => (error: unknown) => {
    if (isApiError(error, 409)) say(t.id, { notice: CHANGED_MESSAGE });
    else if (isApiError(error, 400) && error.fields?.note) say(t.id, { noteError: error.fields.note, error: error.message });
    else say(t.id, { error: error instanceof Error ? error.message : 'Something went wrong. Try again.' });
  };
  // The task moves to another group once changed, taking its buttons with it: the focus goes to what was said.
  const report = (text: string) => {
    setStatus(text);
    statusRef.current?.focus();
  };
  const start = (t: TaskView) => {
    say(t.id, {});
    setStatus(null);
  };
  const actions = {
    done: (t: TaskView, note: string) => {
      start(t);
      // Made on pressing Done: a copy kept offline and sent later carries the same key, so it counts once.
      const key = crypto.randomUUID();
      const body = { version: t.version, note };
      done.mutate(
        { taskId: t.id, body, key },
        {
          onSuccess: () => report(`Done: ${t.title}.`),
          onError: (error) => {
            if (!isOffline(error) || !userId) return onError(t)(error);
            const entry = {
              key,
              page: `task-done:${plotId}`,
              userId,
              method: 'POST' as const,
              path: `/api/tasks/${t.id}/done`,
              body: taskStatusBody(body),
              label: `Done: ${t.title}`,
              createdAt: new Date().toISOString(),
            };
            putEntry(entry).then(
              () => say(t.id, { notice: 'No connection: kept on this phone, waiting to send.' }),
              () => onError(t)(error),
            );
          },
        },
      );
    },
    skip: (t: TaskView) => {
      start(t);
      skip.mutate({ taskId: t.id, body: { version: t.version, note: '' } }, { onSuccess: () => report(`Not needed: ${t.title}.`), onError: onError(t) });
    },
    reopen: (t: TaskView) => {
      start(t);
      reopen.mutate({ taskId: t.id, body: { version: t.version, note: '' } }, { onSuccess: () => report(`Back to do: ${t.title}.`), onError: onError(t) });
    },
  };
  const busyOf = (t: TaskView): TaskBusy =>
    done.isPending && done.variables?.taskId === t.id
      ? 'done'
      : skip.isPending && skip.variables?.taskId === t.id
        ? 'skip'
        : reopen.isPending && reopen.variables?.taskId === t.id
          ? 'reopen'
          : null;

  return (
    <div className="flex flex-col gap-5">
      <WaitingToSend entries={queue.entries} sending={queue.sending} onRetry={() => void queue.retry()} onDiscard={(k) => void queue.discard(k)} />
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
        <p className="max-w-prose text-sm text-stone">
          The care this plot needs, worked out from its plantings, the crop notes and the weather logged at {siteName}, plus the club's shared jobs.
          Dates are in {siteName}'s time zone.{' '}
          <Link to={paths.siteWater(clubId, siteId)} className="inline-flex items-center gap-1 font-medium">
            <Droplets className="size-4" aria-hidden="true" />
            Water need at {siteName}
          </Link>
        </p>
        {data.canWrite && (
          <Button variant="secondary" className="shrink-0" onClick={() => setAway(true)}>
            <Luggage className="size-5" aria-hidden="true" />
            Away? Ask the volunteers to cover
          </Button>
        )}
      </div>

      <div ref={statusRef} tabIndex={-1} role="status" aria-live="polite" className="focus:outline-none">
        {status && (
          <Alert tone="success" announce={false}>
            {status}
          </Alert>
        )}
      </div>
      {handoverError && <Alert tone="error">{handoverError}</Alert>}

      <HandoversList
        handovers={data.handovers}
        today={data.today}
        canWrite={data.canWrite}
        cancelling={cancelHandover.isPending ? (cancelHandover.variables ?? null) : null}
        onCancel={(id) => {
          setHandoverError(null);
          setStatus(null);
          cancelHandover.mutate(id, {
            onSuccess: () => report('The cover is cancelled; those tasks are yours again.'),
            onError: (error) => setHandoverError(error.message),
          });
        }}
      />

      {groups.length === 0 ? (
        <p className="text-stone">
          No tasks for this plot yet. They are worked out from the plot's plantings and the weather, and the coordinators add shared jobs.
        </p>
      ) : (
        nothingToDo(data) && <p className="font-medium">Nothing to do for now.</p>
      )}

      {groups.map((group) => {
        const headingId = `tasks-${group.key}`;
        const title = `${group.title} (${group.tasks.length})`;
        if (group.collapsed) {
          const shown = openLater;
          return (
            <section key={group.key} aria-labelledby={headingId} className="flex flex-col gap-3">
              <div className="flex flex-wrap items-center justify-between gap-3">
                <h3 id={headingId} className="text-lg font-semibold">
                  {title}
                </h3>
                <Button variant="ghost" aria-expanded={shown} aria-controls={`${headingId}-list`} onClick={() => setOpenLater(!shown)}>
                  <ChevronDown className={`size-5 transition-transform ${shown ? 'rotate-180' : ''}`} aria-hidden="true" />
                  {shown ? 'Hide the later tasks' : `Show the later tasks`}
                </Button>
              </div>
              <div id={`${headingId}-list`} hidden={!shown}>
                <GroupList group={group} data={data} busyOf={busyOf} feedback={feedback} actions={actions} />
              </div>
            </section>
          );
        }
        return (
          <section key={group.key} aria-labelledby={headingId} className="flex flex-col gap-3">
            <h3 id={headingId} className="text-lg font-semibold">
              {title}
            </h3>
            <GroupList group={group} data={data} busyOf={busyOf} feedback={feedback} actions={actions} />
          </section>
        );
      })}

      <HandoverDialog
        open={away}
        plotId={plotId}
        plotLabel={plotLabel}
        today={data.today}
        onClose={() => setAway(false)}
        onDone={(h) => {
          setAway(false);
          setStatus(
            `Asked the volunteers to cover ${taskWindow(h.fromOn, h.toOn, data.today)}: ${
              h.tasksHanded === 0 ? 'no tasks fall in those days yet.' : `${plural(h.tasksHanded, 'task')} handed over.`
            }`,
          );
        }}
      />
    </div>
  );
}
