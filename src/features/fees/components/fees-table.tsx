import { useMemo } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import { formatMoney } from '@shared/fees/compute';
import type { Fee } from '@shared/schemas/fees';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { useTimeZone } from '@/lib/time-zone';
import { formatCalendarDate, todayIso } from '../lib/money-form';
import { BalanceText } from './balance-text';

const money = (minor: number, fee: Fee) => <span className="whitespace-nowrap tabular-nums">{formatMoney(minor, fee.currency)}</span>;

function columns(onRecord: (feeId: number) => void, today: string): ColumnDef<Fee>[] {
  return [
    {
      id: 'holder',
      header: 'Holder',
      // The e-mail is in the filter text but not on screen, to keep the table narrow; the payment panel shows it.
      accessorFn: (f) => `${f.holderName} ${f.holderEmail}`,
      cell: ({ row }) => <span className="font-medium whitespace-nowrap">{row.original.holderName}</span>,
    },
    { id: 'plot', header: 'Plot', accessorFn: (f) => f.plotLabel, cell: ({ row }) => <span className="whitespace-nowrap">{row.original.plotLabel}</span> },
    { id: 'site', header: 'Site', accessorFn: (f) => f.siteName, cell: ({ row }) => <span className="block min-w-20">{row.original.siteName}</span> },
    { id: 'season', header: 'Season', accessorFn: (f) => String(f.seasonYear) },
    {
      id: 'fee',
      header: 'Fee',
      accessorFn: (f) => f.plotFeeMinor,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <div className="flex flex-col items-start gap-1">
          {money(row.original.plotFeeMinor, row.original)}
          {row.original.isConcession && <Badge tone="straw">Concession</Badge>}
        </div>
      ),
    },
    { id: 'deposit', header: 'Deposit', accessorFn: (f) => f.depositMinor, enableGlobalFilter: false, cell: ({ row }) => money(row.original.depositMinor, row.original) },
    { id: 'paid', header: 'Paid', accessorFn: (f) => f.paidMinor, enableGlobalFilter: false, cell: ({ row }) => money(row.original.paidMinor, row.original) },
    { id: 'balance', header: 'Balance', accessorFn: (f) => f.balanceMinor, enableGlobalFilter: false, cell: ({ row }) => <BalanceText fee={row.original} /> },
    {
      id: 'due',
      header: 'Due',
      // YYYY-MM-DD strings sort in date order.
      accessorFn: (f) => f.dueOn,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <div className="flex flex-col items-start gap-1 whitespace-nowrap">
          {formatCalendarDate(row.original.dueOn)}
          {row.original.balanceMinor > 0 && row.original.dueOn < today && <Badge tone="straw">Overdue</Badge>}
        </div>
      ),
    },
    {
      id: 'actions',
      // A visible header: an sr-only one is absolutely placed and would widen the page past the table's scroll box.
      header: 'Payment',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <Button
          variant="secondary"
          className="px-3 whitespace-nowrap"
          onClick={() => onRecord(row.original.id)}
          aria-label={`Record payment for ${row.original.holderName}, plot ${row.original.plotLabel}`}
        >
          Record
        </Button>
      ),
    },
  ];
}

/** The club's fees in the server's order (owed first, then by due date), sortable and filterable. */
export function FeesTable({ fees, onRecord }: { fees: Fee[]; onRecord: (feeId: number) => void }) {
  const zone = useTimeZone();
  const cols = useMemo(() => columns(onRecord, todayIso(zone)), [onRecord, zone]);
  return (
    <DataTable
      data={fees}
      columns={cols}
      caption="Plot fees"
      filterLabel="Filter by holder, plot or site"
      emptyMessage="No fees here. A fee is charged when someone accepts an offer or keeps their plot."
      pageSizes={[25, 50, 100]}
      getRowId={(fee) => String(fee.id)}
    />
  );
}
