import type { ColumnDef } from '@tanstack/react-table';
import type { Mailing } from '@shared/schemas/mailings';
import { DataTable } from '@/components/ui/data-table';
import { LocalDate } from '@/lib/time-zone';

const columns: ColumnDef<Mailing>[] = [
  {
    id: 'sent',
    header: 'Sent',
    accessorFn: (m) => m.createdAt,
    enableGlobalFilter: false,
    cell: ({ row }) => <span className="whitespace-nowrap"><LocalDate value={row.original.createdAt} /></span>,
  },
  {
    id: 'subject',
    header: 'Subject',
    accessorFn: (m) => m.subject,
    cell: ({ row }) => <span className="font-medium">{row.original.subject}</span>,
  },
  { id: 'to', header: 'To', accessorFn: (m) => m.audienceLabel },
  {
    id: 'delivered',
    header: 'Delivered',
    accessorFn: (m) => m.sentCount,
    enableGlobalFilter: false,
    cell: ({ row }) => (
      <span className="whitespace-nowrap tabular-nums">
        {row.original.sentCount} of {row.original.recipientCount}
      </span>
    ),
  },
  { id: 'by', header: 'By', accessorFn: (m) => m.sentByName ?? '', cell: ({ getValue }) => getValue<string>() || '–' },
];

/** Messages the club has sent, newest first. */
export function MailingsTable({ mailings }: { mailings: Mailing[] }) {
  return (
    <DataTable
      data={mailings}
      columns={columns}
      caption="Sent messages"
      filterLabel="Filter messages"
      emptyMessage="Nothing sent yet. Messages you send appear here with how many people they reached."
      initialSorting={[{ id: 'sent', desc: true }]}
      pageSizes={[10, 25, 50]}
      getRowId={(m) => String(m.id)}
    />
  );
}
