import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { Download, Timer } from 'lucide-react';
import { localToday } from '@shared/dates';
import type { HoursRow } from '@shared/schemas/shifts';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { CardSection, PageSection } from '@/components/ui/page-section';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { hoursCsvUrl, useHours } from '../api/get-hours';
import { hoursText } from '../lib/words';
import { FeedPanel } from './feed-panel';

/** How many seasons back the year list goes. */
const YEARS_BACK = 5;

const hoursCell = (v: number | null, none: string) => (v === null ? none : hoursText(v));

const columns: ColumnDef<HoursRow>[] = [
  { id: 'name', header: 'Name', accessorFn: (r) => r.name, cell: ({ row }) => <span className="font-semibold break-words">{row.original.name}</span> },
  { id: 'shiftsDone', header: 'Shifts done', accessorFn: (r) => r.shiftsDone, enableGlobalFilter: false },
  { id: 'hours', header: 'Hours', accessorFn: (r) => r.hours, enableGlobalFilter: false, cell: ({ row }) => hoursText(row.original.hours) },
  {
    id: 'required',
    header: 'Asked',
    accessorFn: (r) => r.required ?? -1,
    enableGlobalFilter: false,
    cell: ({ row }) => hoursCell(row.original.required, 'None set'),
  },
  {
    id: 'remaining',
    header: 'Still to do',
    accessorFn: (r) => r.remaining ?? -1,
    enableGlobalFilter: false,
    cell: ({ row }) => (row.original.remaining === 0 ? 'Met' : hoursCell(row.original.remaining, '—')),
  },
];

export interface HoursPageProps {
  clubId: number;
  clubName: string;
  timeZone: string;
}

/**
 * `/clubs/:clubId/hours?year=` (coordinators): each volunteer's shifts done and hours in a season,
 * against what the club asks, as a table with a CSV download; and the club's calendar address.
 */
export function HoursPage({ clubId, clubName, timeZone }: HoursPageProps) {
  const [params, setParams] = useSearchParams();
  const thisYear = Number(localToday(timeZone).slice(0, 4));
  const years = Array.from({ length: YEARS_BACK }, (_, i) => thisYear - i);
  const asked = Number(params.get('year'));
  const year = years.includes(asked) ? asked : null;
  const table = useHours(clubId, year);
  const shownYear = table.data?.year ?? year ?? thisYear;
  const choices = years.includes(shownYear) ? years : [shownYear, ...years];

  const rows = useMemo(() => table.data?.items ?? [], [table.data]);
  const total = rows.reduce((sum, r) => sum + r.hours, 0);

  let body;
  if (table.isPending) body = <LoadingState label="Adding up the hours…" />;
  else if (table.isError) {
    body = (
      <ErrorState
        title="The hours didn't load"
        message={table.error.message}
        requestId={isApiError(table.error) ? table.error.requestId : undefined}
        onRetry={() => void table.refetch()}
        retrying={table.isFetching}
      />
    );
  } else if (rows.length === 0) {
    body = (
      <Card>
        <EmptyState icon={Timer} title={`No volunteer hours in ${shownYear}`}>
          <p>Hours are counted when volunteers mark their shifts done.</p>
        </EmptyState>
      </Card>
    );
  } else {
    body = (
      <PageSection id="hours-table" title={`Hours in ${shownYear}`}>
        <p className="mb-3 text-stone" role="status">
          {rows.length === 1 ? '1 volunteer' : `${rows.length} volunteers`} gave {hoursText(total)}
          {table.data.required !== null ? `; the club asks each volunteer for ${hoursText(table.data.required)}.` : '; the club asks for no set number.'}
        </p>
        <DataTable
          data={rows}
          columns={columns}
          caption={`Volunteer hours in ${shownYear}`}
          filterLabel="Search by name"
          emptyMessage="No volunteer hours this season."
          initialSorting={[{ id: 'name', desc: false }]}
          pageSizes={[25, 50, 100]}
          getRowId={(r) => String(r.userId)}
        />
      </PageSection>
    );
  }

  return (
    <>
      <title>{`Volunteer hours · ${clubName} · Tillwell`}</title>
      <PageHeader eyebrow={clubName} title="Volunteer hours" description="Each volunteer's shifts done and hours given in a season, against what the club asks." />
      <div className="flex min-w-0 flex-col gap-8">
        <form aria-label="Season" onSubmit={(e) => e.preventDefault()} className="grid grid-cols-1 gap-3 sm:grid-cols-[minmax(0,12rem)_auto] sm:items-end sm:justify-start">
          <Select
            label="Season"
            value={String(shownYear)}
            onChange={(e) => {
              const next = new URLSearchParams(params);
              next.set('year', e.target.value);
              setParams(next, { replace: true });
            }}
          >
            {choices.map((y) => (
              <option key={y} value={y}>
                {y}
              </option>
            ))}
          </Select>
          <a href={hoursCsvUrl(clubId, shownYear)} download className={buttonClasses('secondary', 'w-full sm:w-auto')}>
            <Download className="size-5" aria-hidden="true" /> Download CSV
          </a>
        </form>
        {body}
        <div className="max-w-2xl">
          <CardSection id="club-feed" title="The club's shifts in a calendar">
            <FeedPanel clubId={clubId} kind="club" timeZone={timeZone} />
          </CardSection>
        </div>
      </div>
    </>
  );
}
