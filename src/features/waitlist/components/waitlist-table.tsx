import { useMemo } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import { ArrowUpDown, History, UserMinus } from 'lucide-react';
import type { WaitlistEntry } from '@shared/schemas/applications';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { LocalDate } from '@/lib/time-zone';
import { formatWaited, needsOf, sizeShortLabels } from '../lib/format';
import { NeedsBadges } from './needs-badges';

export type WaitlistAction = 'move' | 'remove' | 'history';
type Row = WaitlistEntry & { order: number };

const statusLabels: Record<WaitlistEntry['status'], string> = {
  waiting: 'Waiting',
  offered: 'Offered',
  allocated: 'Has a plot',
  removed: 'Removed',
  withdrawn: 'Withdrew',
};

function columns(onAction: (action: WaitlistAction, entry: WaitlistEntry) => void): ColumnDef<Row>[] {
  return [
    {
      id: 'position',
      header: 'Place',
      // Sorting follows the queue itself, so people who are not waiting stay where the queue puts them.
      accessorFn: (e) => e.order,
      enableGlobalFilter: false,
      cell: ({ row }) =>
        row.original.position !== null ? (
          <span className="text-lg font-semibold tabular-nums">{row.original.position}</span>
        ) : (
          <Badge tone="neutral">{statusLabels[row.original.status]}</Badge>
        ),
    },
    {
      id: 'name',
      header: 'Name',
      accessorFn: (e) => `${e.name} ${e.email} ${e.phone}`,
      cell: ({ row }) => (
        <div className="min-w-36">
          <span className="block font-medium">{row.original.name}</span>
          <a href={`mailto:${row.original.email}`} className="block py-3 text-sm break-all">
            {row.original.email}
          </a>
          {row.original.phone && <span className="block text-sm whitespace-nowrap text-stone">{row.original.phone}</span>}
        </div>
      ),
    },
    {
      id: 'waited',
      header: 'Waited',
      accessorFn: (e) => e.waitedDays,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <div className="whitespace-nowrap">
          <span className="block">{formatWaited(row.original.waitedDays)}</span>
          <span className="block text-sm text-stone">applied <LocalDate value={row.original.appliedAt} /></span>
        </div>
      ),
    },
    {
      id: 'size',
      header: 'Size',
      accessorFn: (e) => sizeShortLabels[e.preferredSize],
    },
    {
      id: 'needs',
      header: 'Needs',
      accessorFn: (e) => needsOf(e).join(', '),
      cell: ({ row }) => <NeedsBadges needs={needsOf(row.original)} />,
    },
    {
      id: 'site',
      header: 'Preferred site',
      accessorFn: (e) => e.preferredSiteName ?? '',
      cell: ({ row }) => row.original.preferredSiteName ?? <span className="text-stone">Any</span>,
    },
    {
      id: 'actions',
      header: 'Actions',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) => {
        const e = row.original;
        return (
          <div className="flex gap-1">
            {e.status === 'waiting' && (
              <>
                <Button variant="secondary" className="px-3" onClick={() => onAction('move', e)} aria-label={`Move ${e.name}`}>
                  <ArrowUpDown className="size-4" aria-hidden="true" />
                  Move
                </Button>
                <Button
                  variant="ghost"
                  className="px-2.5"
                  onClick={() => onAction('remove', e)}
                  aria-label={`Remove ${e.name}`}
                  title="Remove from the waiting list"
                >
                  <UserMinus className="size-5" aria-hidden="true" />
                </Button>
              </>
            )}
            <Button
              variant="ghost"
              className="px-2.5"
              onClick={() => onAction('history', e)}
              aria-label={`History of ${e.name}`}
              title="History"
            >
              <History className="size-5" aria-hidden="true" />
            </Button>
          </div>
        );
      },
    },
  ];
}

/** The waiting list in queue order, with move, remove and history for each person. */
export function WaitlistTable({
  entries,
  onAction,
}: {
  entries: WaitlistEntry[];
  onAction: (action: WaitlistAction, entry: WaitlistEntry) => void;
}) {
  const rows = useMemo(() => entries.map((e, order) => ({ ...e, order })), [entries]);
  const cols = useMemo(() => columns(onAction), [onAction]);
  return (
    <DataTable
      data={rows}
      columns={cols}
      caption="Waiting list"
      filterLabel="Find a person"
      emptyMessage="Nobody matches. Share the application form to start the waiting list."
      initialSorting={[{ id: 'position', desc: false }]}
      pageSizes={[25, 50, 100]}
      getRowId={(e) => String(e.id)}
    />
  );
}
