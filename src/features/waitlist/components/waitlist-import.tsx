import type { ColumnDef } from '@tanstack/react-table';
import { waitlistCsvColumns, type WaitlistImportResult } from '@shared/schemas/member-imports';
import { checkColumn, CsvImport, rowColumn, twoLineColumn, type PreviewRow } from '@/components/ui/csv-import';
import { LocalDate } from '@/lib/time-zone';
import { useImportWaitlist } from '../api/import-waitlist';
import { waitlistTemplateUrl } from '../api/waitlist-files';
import { needsOf, sizeShortLabels } from '../lib/format';
import { NeedsBadges } from './needs-badges';

type Row = WaitlistImportResult['rows'][number];

const columns: ColumnDef<PreviewRow<Row>>[] = [
  rowColumn<Row>(),
  twoLineColumn<Row>({ id: 'name', header: 'Name', main: (r) => r.name || '(no name)', sub: (r) => r.email }),
  {
    id: 'applied',
    header: 'Applied',
    accessorFn: (r) => r.entry?.appliedOn ?? '',
    cell: ({ row }) => {
      const entry = row.original.entry;
      if (!entry) return '–';
      return <span className="whitespace-nowrap">{entry.appliedOn ? <LocalDate value={entry.appliedOn} /> : 'Today'}</span>;
    },
  },
  {
    id: 'size',
    header: 'Size',
    accessorFn: (r) => (r.entry ? sizeShortLabels[r.entry.preferredSize] : ''),
  },
  {
    id: 'needs',
    header: 'Needs',
    accessorFn: (r) => (r.entry ? needsOf(r.entry).join(', ') : ''),
    cell: ({ row }) => <NeedsBadges needs={row.original.entry ? needsOf(row.original.entry) : []} />,
  },
  {
    id: 'site',
    header: 'Site',
    accessorFn: (r) => r.entry?.preferredSiteName ?? '',
    cell: ({ row }) => row.original.entry?.preferredSiteName ?? '–',
  },
  checkColumn<Row>(),
];

/** Brings a waiting list kept elsewhere (a spreadsheet) into Tillwell, keeping everyone's original place. */
export function WaitlistImport({ clubId }: { clubId: number }) {
  const run = useImportWaitlist(clubId);
  return (
    <CsvImport
      textLabel="Waiting list rows"
      columnsHint={`The first line names the columns: name and email, then any of ${waitlistCsvColumns.slice(2).join(', ')}. applied_on (like 2024-03-15) keeps each person's place; rows without it join at the back in file order.`}
      noun={{ one: 'person', many: 'people' }}
      templateUrl={waitlistTemplateUrl(clubId)}
      check={(csv) => run.mutateAsync({ csv, commit: false })}
      commit={(csv) => run.mutateAsync({ csv, commit: true })}
      columns={columns}
      done={(result) => `Added ${result.counts.imported} ${result.counts.imported === 1 ? 'person' : 'people'} to the waiting list, in order of when they applied.`}
    />
  );
}
