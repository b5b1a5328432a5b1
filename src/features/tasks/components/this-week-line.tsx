import { Link } from 'react-router-dom';
import { ListTodo } from 'lucide-react';
import { plural } from '@/lib/format';
import { paths } from '@/lib/paths';
import { usePlotTasks } from '../api/get-plot-tasks';
import { openThisWeek } from '../lib/groups';

/** The words of the line, for a count of open tasks due now or overdue. */
export function thisWeekWords(count: number): string {
  return count === 0 ? 'nothing left to do' : `${plural(count, 'task')} to do`;
}

/** "This week: 3 tasks to do" with a link to the plot book's Tasks; shown only once the tasks have answered. */
export function ThisWeekLine({ clubId, plotId }: { clubId: number; plotId: number }) {
  // A plot whose tasks cannot be read (none yet, or an older server) just goes without the line.
  const tasks = usePlotTasks(plotId, { retry: false });
  if (!tasks.isSuccess) return null;
  const count = openThisWeek(tasks.data);
  return (
    <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
      <ListTodo className="size-5 shrink-0 text-leaf" aria-hidden="true" />
      <span>
        <span className="font-semibold">This week:</span> {thisWeekWords(count)}
      </span>
      <Link to={paths.plotBookTasks(clubId, plotId)} className="inline-flex min-h-11 items-center font-medium">
        See the tasks
      </Link>
    </p>
  );
}
