import { useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { RefreshCw } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useTaskRun } from '../api/get-task-run';
import { invalidateTaskLists } from '../api/invalidate';
import { useStartTaskRun } from '../api/start-task-run';
import { runIsActive, runSummary } from '../lib/runs';
import { RunProgress } from './run-progress';

/**
 * "Make tasks now": starts a run of the task generator for the site and follows it until it is done; then the
 * table reads the tasks again and the page says what changed.
 */
export function MakeTasksNow({ siteId, siteName }: { siteId: number; siteName: string }) {
  const queryClient = useQueryClient();
  const start = useStartTaskRun(siteId);
  const [runId, setRunId] = useState<number | null>(null);
  const run = useTaskRun(runId);
  const finished = useRef<number | null>(null);
  const active = run.data ? runIsActive(run.data) : false;

  // Once a run is over, the table reads the site's tasks again (once per run).
  useEffect(() => {
    const r = run.data;
    if (r && !runIsActive(r) && finished.current !== r.id) {
      finished.current = r.id;
      void invalidateTaskLists(queryClient);
    }
  }, [run.data, queryClient]);

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-3 sm:flex-row sm:items-center sm:justify-between">
        <p className="max-w-prose text-stone">
          Tasks are worked out every night from the plantings at {siteName}, the crop notes and the weather logged. After a
          change you want to see today, work them out again now; done tasks and the tasks you added stay as they are.
        </p>
        <Button
          className="shrink-0"
          onClick={() => start.mutate(undefined, { onSuccess: (r) => setRunId(r.id) })}
          loading={start.isPending}
          loadingText="Starting…"
          disabled={active}
        >
          <RefreshCw className={`size-5 ${active ? 'animate-spin' : ''}`} aria-hidden="true" />
          Make tasks now
        </Button>
      </div>
      {start.isError && <Alert tone="error">{start.error.message}</Alert>}
      {run.isError && <Alert tone="error">Could not see how far the run got: {run.error.message}</Alert>}
      {/* The bar is not a live region (it would talk every second); this line, always in the page, says how it ended. */}
      <p className="sr-only" role="status">
        {run.data?.status === 'done' ? `${runSummary(run.data)}.` : run.data?.status === 'failed' ? 'The tasks could not be made.' : ''}
      </p>
      {run.data && <RunProgress run={run.data} />}
    </div>
  );
}
