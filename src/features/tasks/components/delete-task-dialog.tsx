import { useState } from 'react';
import type { TaskView } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { isApiError } from '@/lib/api/client';
import { useDeleteTask } from '../api/delete-task';
import { taskDate } from '../lib/dates';

/** Asks before a coordinator's task goes: one date of it only; other dates of a repeating task stay. */
export function DeleteTaskDialog({
  task,
  today,
  onClose,
  onDeleted,
}: {
  task: TaskView | null;
  today: string;
  onClose: () => void;
  onDeleted: (task: TaskView) => void;
}) {
  const remove = useDeleteTask();
  const [error, setError] = useState<string | null>(null);
  const close = () => {
    setError(null);
    onClose();
  };
  return (
    <Dialog
      open={task !== null}
      onClose={close}
      title={task ? `Delete “${task.title}”?` : 'Delete the task?'}
      description={
        task && (
          <p>
            The task for {task.plotLabel ? `plot ${task.plotLabel}` : 'the whole site'} due {taskDate(task.dueOn, today)} goes, and it cannot be undone. If
            it repeats, its other dates stay.
          </p>
        )
      }
    >
      {error && <Alert tone="error">{error}</Alert>}
      <div className="flex flex-wrap gap-3">
        <Button
          variant="danger"
          loading={remove.isPending}
          loadingText="Deleting…"
          onClick={() =>
            task &&
            remove.mutate(task.id, {
              onSuccess: () => {
                setError(null);
                onDeleted(task);
              },
              // Gone already (someone else deleted it): the list has been read again, so say so and close.
              onError: (e) => (isApiError(e, 404) ? onDeleted(task) : setError(e.message)),
            })
          }
        >
          Yes, delete the task
        </Button>
        <Button variant="secondary" onClick={close} disabled={remove.isPending}>
          Keep it
        </Button>
      </div>
    </Dialog>
  );
}
