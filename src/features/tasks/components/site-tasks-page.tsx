import { Fragment, useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { Download, Droplets, ListChecks, Plus, Trash2, TriangleAlert, X } from 'lucide-react';
import type { UnitSystem } from '@shared/geometry';
import { taskKinds, taskStatuses, type TaskView } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { TextField } from '@/components/ui/field';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { siteTasksCsvUrl, useSiteTasks } from '../api/get-site-tasks';
import { taskDate, taskWindow, taskWindowWords } from '../lib/dates';
import { filtersFromParams, isFiltered } from '../lib/filters';
import { addedWords, canDeleteTask, countWords, dateRangeError, whereWords, whoForWords, withFilter, withoutFilters } from '../lib/site-table';
import { formatWaterAmount } from '../lib/units';
import { kindWords, statusWords } from '../lib/words';
import { AddTaskDialog, type TaskPlotOption } from './add-task-dialog';
import { DeleteTaskDialog } from './delete-task-dialog';
import { KindTag } from './kind-tag';
import { MakeTasksNow } from './make-tasks-now';

export interface SiteTasksPageProps {
  clubId: number;
  site: { id: number; name: string; units: UnitSystem; timeZone: string };
  /** The site's plots, for the plot filter and the add dialog. */
  plots: readonly TaskPlotOption[];
  /** Every site of the club, to switch between their tasks when there are several. */
  sites: ReadonlyArray<{ id: number; name: string }>;
}

const statusTone: Record<TaskView['status'], string> = {
  open: 'border-paper-300 bg-white text-soil',
  done: 'border-leaf-100 bg-leaf-50 text-leaf-800',
  skipped: 'border-paper-300 bg-paper-100 text-stone',
};

function columnsFor(opts: {
  clubId: number;
  today: string;
  units: UnitSystem;
  plotKinds: Map<number, string>;
  remove: (t: TaskView) => void;
}): ColumnDef<TaskView>[] {
  const { clubId, today, units, plotKinds } = opts;
  return [
    {
      id: 'due',
      header: 'Due',
      accessorFn: (t) => t.dueOn,
      cell: ({ row }) => {
        const t = row.original;
        return (
          <span className="block sm:min-w-28">
            <span className="block font-semibold whitespace-nowrap">{taskDate(t.dueOn, today)}</span>
            <span className="block text-sm text-stone">
              <span className="sr-only">Window: {taskWindowWords(t.windowFrom, t.windowTo, today)}</span>
              <span aria-hidden="true">
                {/* Each end of the window stays on one line; a narrow column breaks at the dash. */}
                {taskWindow(t.windowFrom, t.windowTo, today)
                  .split(' – ')
                  .map((end, i) => (
                    <Fragment key={end}>
                      {i > 0 && ' – '}
                      <span className="whitespace-nowrap">{end}</span>
                    </Fragment>
                  ))}
              </span>
            </span>
          </span>
        );
      },
    },
    {
      id: 'kind',
      header: 'Kind',
      accessorFn: (t) => kindWords[t.kind],
      // A block around the tag, so a phone's card layout does not stretch it across the row.
      cell: ({ row }) => (
        <span className="block">
          <KindTag kind={row.original.kind} />
        </span>
      ),
    },
    {
      id: 'plot',
      header: 'Plot',
      accessorFn: (t) => whereWords(t),
      sortingFn: (a, b) => whereWords(a.original).localeCompare(whereWords(b.original), 'en', { numeric: true }),
      cell: ({ row }) =>
        row.original.plotId ? (
          <Link to={paths.plotBookTasks(clubId, row.original.plotId)} className="inline-flex min-h-11 min-w-11 items-center font-semibold whitespace-nowrap">
            {row.original.plotLabel}
          </Link>
        ) : (
          <span className="whitespace-nowrap">Whole site</span>
        ),
    },
    {
      id: 'task',
      header: 'Task',
      accessorFn: (t) => `${t.title} ${t.cropName ?? ''} ${t.details}`,
      sortingFn: (a, b) => a.original.title.localeCompare(b.original.title),
      cell: ({ row }) => {
        const t = row.original;
        const amount = t.kind === 'water' ? formatWaterAmount(t.amountMm, t.amountL, units) : null;
        return (
          <span className="block break-words sm:min-w-64">
            <span className="block font-medium">{t.title}</span>
            {amount && (
              <span className="mt-0.5 flex items-center gap-1.5 text-sm font-medium">
                <Droplets className="size-4 shrink-0 text-water-700" aria-hidden="true" />
                <span>
                  <span className="sr-only">Amount: </span>
                  {amount}
                </span>
              </span>
            )}
            {t.details && <span className="mt-0.5 block text-sm whitespace-pre-line text-stone">{t.details}</span>}
            {t.caution && (
              <span className="mt-1 flex items-start gap-1.5 text-sm text-clay-700">
                <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden="true" />
                <span>Take care: {t.caution}</span>
              </span>
            )}
            {t.origin === 'coordinator' && <span className="mt-0.5 block text-sm text-stone">Added by a coordinator</span>}
          </span>
        );
      },
    },
    {
      id: 'status',
      header: 'Status',
      accessorFn: (t) => statusWords[t.status],
      cell: ({ row }) => {
        const t = row.original;
        return (
          <span className="block whitespace-nowrap">
            <span className={`inline-flex rounded-full border px-2.5 py-0.5 text-sm font-medium ${statusTone[t.status]}`}>{statusWords[t.status]}</span>
            {t.doneOn && <span className="mt-0.5 block text-sm text-stone">on {taskDate(t.doneOn, today)}</span>}
          </span>
        );
      },
    },
    {
      id: 'who',
      header: 'Who for',
      accessorFn: (t) => whoForWords(t, t.plotId ? plotKinds.get(t.plotId) : undefined),
      cell: ({ getValue }) => <span className="block sm:min-w-28">{getValue<string>()}</span>,
    },
    {
      id: 'actions',
      header: 'Change',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) =>
        canDeleteTask(row.original) ? (
          <Button variant="ghost" className="-my-2 px-2 max-sm:w-full max-sm:justify-start" onClick={() => opts.remove(row.original)}>
            <Trash2 className="size-4" aria-hidden="true" />
            Delete <span className="sr-only">{`${row.original.title}, ${taskDate(row.original.dueOn, today)}`}</span>
          </Button>
        ) : (
          <span className="block text-sm text-stone sm:max-w-32">Follows its planting</span>
        ),
    },
  ];
}

/**
 * A site's tasks for its coordinators: the filters live in the URL and go to the server (and to the CSV link),
 * the table sorts and searches what came back; coordinators add one-off or repeating tasks, delete the ones they
 * added, and can work the planted tasks out again now.
 */
export function SiteTasksPage({ clubId, site, plots, sites }: SiteTasksPageProps) {
  const [params, setParams] = useSearchParams();
  const plotIds = useMemo(() => plots.map((p) => p.id), [plots]);
  const filters = filtersFromParams(params, plotIds);
  const rangeError = dateRangeError(filters);
  const list = useSiteTasks(site.id, filters, { enabled: rangeError === null });
  const [adding, setAdding] = useState(false);
  const [deleting, setDeleting] = useState<TaskView | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const filtered = isFiltered(filters);
  const plotKinds = useMemo(() => new Map(plots.map((p) => [p.id, p.kind])), [plots]);
  const sortedPlots = useMemo(() => [...plots].sort((a, b) => a.label.localeCompare(b.label, 'en', { numeric: true })), [plots]);
  const today = list.data?.today;
  const units = list.data?.units ?? site.units;

  const columns = useMemo(
    () =>
      columnsFor({
        clubId,
        today: today ?? '',
        units,
        plotKinds,
        remove: (t) => {
          setNotice(null);
          setDeleting(t);
        },
      }),
    [clubId, today, units, plotKinds],
  );

  const setFilter = (name: Parameters<typeof withFilter>[1], value: string) => {
    setNotice(null);
    setParams(withFilter(params, name, value), { replace: true });
  };

  let body;
  if (rangeError) {
    body = (
      <Card>
        <EmptyState icon={ListChecks} title="Those dates are the wrong way round">
          <p>Set the last date on or after the first, or clear one of them.</p>
        </EmptyState>
      </Card>
    );
  } else if (list.isPending) body = <LoadingState label="Loading the tasks…" />;
  else if (list.isError) {
    body = (
      <ErrorState
        title="The tasks didn't load"
        message={list.error.message}
        requestId={isApiError(list.error) ? list.error.requestId : undefined}
        onRetry={() => void list.refetch()}
        retrying={list.isFetching}
      />
    );
  } else if (list.data.items.length === 0 && !filtered) {
    body = (
      <Card>
        <EmptyState icon={ListChecks} title="No tasks in these weeks">
          <p>
            Nothing at {site.name} is due from four weeks ago to eight weeks ahead. Tasks appear as holders add plantings to their plot books; add
            jobs for shared beds and the whole site with Add a task, or pick other dates above.
          </p>
        </EmptyState>
      </Card>
    );
  } else {
    body = (
      <>
        <p className="mb-3 text-stone" role="status">
          {countWords(list.data.items.length, filtered)}
          {filters.from || filters.to ? '' : ', from four weeks ago to eight weeks ahead'}.
        </p>
        <DataTable
          data={list.data.items}
          columns={columns}
          caption={`Tasks at ${site.name}`}
          filterLabel="Search the tasks"
          emptyMessage="No tasks match these filters."
          initialSorting={[{ id: 'due', desc: false }]}
          pageSizes={[25, 50, 100]}
          getRowId={(t) => String(t.id)}
        />
      </>
    );
  }

  return (
    <>
      <title>{`Tasks · ${site.name} · Tillwell`}</title>
      <PageHeader
        eyebrow={site.name}
        title={`Tasks at ${site.name}`}
        description={`Every task at the site: those worked out from the plantings and those coordinators add. Dates are days at the site (${site.timeZone.replace(/_/g, ' ')}).`}
        actions={
          <>
            <Button onClick={() => setAdding(true)} disabled={!today}>
              <Plus className="size-5" aria-hidden="true" />
              Add a task
            </Button>
            <Link to={paths.siteWater(clubId, site.id)} className={buttonClasses('secondary')}>
              <Droplets className="size-5" aria-hidden="true" />
              Water
            </Link>
          </>
        }
      />
      {sites.length > 1 && (
        <nav aria-label="Sites" className="mb-6 flex flex-wrap gap-2">
          {sites.map((s) => (
            <Link
              key={s.id}
              to={paths.siteTasks(clubId, s.id)}
              aria-current={s.id === site.id ? 'page' : undefined}
              className={`inline-flex min-h-11 items-center rounded-full border px-4 font-medium no-underline ${
                s.id === site.id ? 'border-leaf bg-leaf text-white' : 'border-paper-300 bg-white text-soil hover:bg-paper-100'
              }`}
            >
              {s.name}
            </Link>
          ))}
        </nav>
      )}
      <div className="flex flex-col gap-6">
        <section aria-labelledby="make-tasks" className="min-w-0">
          <Card>
            <h2 id="make-tasks" className="mb-3 text-xl font-semibold">
              Make tasks now
            </h2>
            <MakeTasksNow siteId={site.id} siteName={site.name} />
          </Card>
        </section>

        <form aria-label="Filters" className="flex flex-col gap-3" onSubmit={(e) => e.preventDefault()}>
          <div className="grid grid-cols-2 gap-3 lg:grid-cols-5 lg:items-start">
            <Select className="max-sm:col-span-2" label="Kind" value={filters.kind ?? ''} onChange={(e) => setFilter('kind', e.target.value)}>
              <option value="">Every kind</option>
              {taskKinds.map((k) => (
                <option key={k} value={k}>
                  {kindWords[k]}
                </option>
              ))}
            </Select>
            <Select className="max-sm:col-span-2" label="Plot" value={String(filters.plotId ?? '')} onChange={(e) => setFilter('plotId', e.target.value)}>
              <option value="">Every plot</option>
              {sortedPlots.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.label}
                </option>
              ))}
            </Select>
            <Select className="max-sm:col-span-2" label="Status" value={filters.status ?? ''} onChange={(e) => setFilter('status', e.target.value)}>
              <option value="">Every status</option>
              {taskStatuses.map((s) => (
                <option key={s} value={s}>
                  {statusWords[s]}
                </option>
              ))}
            </Select>
            <TextField label="From" type="date" value={filters.from ?? ''} onChange={(e) => setFilter('from', e.target.value)} />
            <TextField label="To" type="date" value={filters.to ?? ''} error={rangeError ?? undefined} onChange={(e) => setFilter('to', e.target.value)} />
          </div>
          <div className="flex flex-wrap gap-3">
            {rangeError ? (
              <span className={buttonClasses('secondary', 'cursor-not-allowed opacity-60')} aria-disabled="true">
                <Download className="size-5" aria-hidden="true" />
                Download CSV
              </span>
            ) : (
              <a href={siteTasksCsvUrl(site.id, filters)} download className={buttonClasses('secondary')}>
                <Download className="size-5" aria-hidden="true" />
                Download CSV
              </a>
            )}
            {filtered && (
              <Button
                variant="ghost"
                onClick={() => {
                  setNotice(null);
                  setParams(withoutFilters(params), { replace: true });
                }}
              >
                <X className="size-5" aria-hidden="true" />
                Clear filters
              </Button>
            )}
          </div>
        </form>

        {list.isFetching && !list.isPending && (
          <LoadingState inline label="Loading those tasks…" />
        )}
        {notice && <Alert tone="success">{notice}</Alert>}
        <PageSection id="site-tasks" title="Tasks">
          {body}
        </PageSection>
      </div>
      {today && (
        <AddTaskDialog
          open={adding}
          siteId={site.id}
          siteName={site.name}
          plots={sortedPlots}
          today={today}
          onClose={() => setAdding(false)}
          onDone={(created) => {
            setAdding(false);
            setNotice(addedWords(created));
          }}
        />
      )}
      <DeleteTaskDialog
        task={deleting}
        today={today ?? ''}
        onClose={() => setDeleting(null)}
        onDeleted={(t) => {
          setDeleting(null);
          setNotice(`Deleted “${t.title}”, due ${taskDate(t.dueOn, today)}.`);
        }}
      />
    </>
  );
}
