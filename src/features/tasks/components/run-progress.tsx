import { useId } from 'react';
import type { TaskRun } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { runIsActive, runPercent, runProgressText, runSummary } from '../lib/runs';

/**
 * How far a run of the task generator got: a real progress bar (role="progressbar", 0 to 100 with the
 * plantings read as its text), then what it changed ("Done: 20 tasks added, 5 moved, 2 removed"), or why it failed.
 */
export function RunProgress({ run }: { run: TaskRun }) {
  const labelId = `${useId()}-run`;
  const active = runIsActive(run);
  const progress = runProgressText(run);
  const percent = runPercent(run);
  return (
    <div className="flex flex-col gap-3">
      {run.status !== 'failed' && (
        <div className="flex flex-col gap-1.5">
          <p className="flex flex-wrap justify-between gap-2 text-sm">
            <span id={labelId} className="font-medium">
              {active ? 'Making tasks…' : 'Plantings read'}
            </span>
            <span className="tabular-nums" aria-hidden="true">
              {progress}
            </span>
          </p>
          <div
            role="progressbar"
            aria-labelledby={labelId}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={percent}
            aria-valuetext={`${percent}%: ${progress}`}
            className="h-3 w-full overflow-hidden rounded-full border border-stone bg-paper-100"
          >
            <div className={`h-full bg-leaf ${active ? 'transition-[width] duration-500' : ''}`} style={{ width: `${percent}%` }} />
          </div>
        </div>
      )}
      {run.status === 'done' && (
        <Alert tone="success" announce={false}>
          {runSummary(run)}.
        </Alert>
      )}
      {run.status === 'failed' && (
        <Alert tone="error" title="The tasks could not be made" announce={false}>
          {run.error ?? 'The run stopped before it finished. Try again; what it had done so far is kept.'}
        </Alert>
      )}
    </div>
  );
}
