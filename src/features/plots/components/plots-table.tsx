import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { Check, Download, FileSpreadsheet, Shovel } from 'lucide-react';
import type { UnitSystem } from '@shared/geometry';
import { plotKindLabels, sunLabels, type Plot } from '@shared/schemas/plots';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useSitePlots } from '../api/get-site-plots';
import { plotsCsvUrl, plotsTemplateUrl } from '../api/plots-csv';
import { formatPlotArea, formatSize } from '../lib/format';

function YesNo({ value, yes }: { value: boolean; yes: string }) {
  return value ? (
    <span className="inline-flex items-center gap-1 font-medium whitespace-nowrap text-leaf-800">
      <Check className="size-4" aria-hidden="true" />
      {yes}
    </span>
  ) : (
    <span className="text-stone">No</span>
  );
}

function columnsFor(clubId: number, units: UnitSystem): ColumnDef<Plot>[] {
  return [
    {
      id: 'label',
      header: 'Label',
      accessorFn: (plot) => plot.label,
      // "A-2" before "A-10", as people number plots.
      sortingFn: 'alphanumeric',
      cell: ({ row }) => (
        <Link to={paths.plot(clubId, row.original.id)} className="inline-flex min-h-11 min-w-11 items-center font-semibold whitespace-nowrap">
          {row.original.label}
        </Link>
      ),
    },
    {
      id: 'kind',
      header: 'Kind',
      accessorFn: (plot) => plotKindLabels[plot.kind],
      cell: ({ getValue }) => <span className="whitespace-nowrap">{getValue<string>()}</span>,
    },
    {
      id: 'size',
      header: 'Size',
      accessorFn: (plot) => plot.width * plot.length,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <span className="whitespace-nowrap tabular-nums">{formatSize(row.original.width, row.original.length, units)}</span>
      ),
    },
    {
      id: 'area',
      header: 'Area',
      accessorFn: (plot) => plot.area,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="whitespace-nowrap tabular-nums">{formatPlotArea(row.original.area, units)}</span>,
    },
    {
      id: 'sun',
      header: 'Sun',
      accessorFn: (plot) => sunLabels[plot.sun],
      cell: ({ getValue }) => <span className="whitespace-nowrap">{getValue<string>()}</span>,
    },
    {
      id: 'soilPh',
      header: 'Soil pH',
      // Untested plots sort after tested ones either way.
      accessorFn: (plot) => plot.soilPh ?? undefined,
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: ({ row }) =>
        row.original.soilPh === null ? (
          <span className="text-stone">Not tested</span>
        ) : (
          <span className="tabular-nums">{row.original.soilPh}</span>
        ),
    },
    {
      id: 'accessible',
      header: 'Accessible',
      accessorFn: (plot) => (plot.isAccessible ? 1 : 0),
      enableGlobalFilter: false,
      cell: ({ row }) => <YesNo value={row.original.isAccessible} yes="Yes" />,
    },
    {
      id: 'waterTap',
      header: 'Water tap',
      accessorFn: (plot) => (plot.hasWaterTap ? 1 : 0),
      enableGlobalFilter: false,
      cell: ({ row }) => <YesNo value={row.original.hasWaterTap} yes="Yes" />,
    },
  ];
}

export interface PlotsTableProps {
  clubId: number;
  siteId: number;
  siteName: string;
  units: UnitSystem;
  /** Coordinators also get the import template. */
  canImport: boolean;
}

/** Every plot on a site with its size in the site's units; each label opens the plot's page. */
export function PlotsTable({ clubId, siteId, siteName, units, canImport }: PlotsTableProps) {
  const plots = useSitePlots(siteId);
  const columns = useMemo(() => columnsFor(clubId, units), [clubId, units]);

  if (plots.isPending) return <LoadingState label="Loading plots…" />;
  if (plots.isError) {
    return (
      <ErrorState
        message={plots.error.message}
        requestId={isApiError(plots.error) ? plots.error.requestId : undefined}
        onRetry={() => void plots.refetch()}
        retrying={plots.isFetching}
      />
    );
  }

  const downloads = (
    <div className="flex flex-wrap gap-3">
      {plots.data.items.length > 0 && (
        <a href={plotsCsvUrl(siteId, units)} download className={buttonClasses('secondary')}>
          <Download className="size-5" aria-hidden="true" />
          Download CSV
        </a>
      )}
      {canImport && (
        <a href={plotsTemplateUrl(siteId, units)} download className={buttonClasses('secondary')}>
          <FileSpreadsheet className="size-5" aria-hidden="true" />
          Template
        </a>
      )}
    </div>
  );

  if (plots.data.items.length === 0) {
    return (
      <Card>
        <EmptyState icon={Shovel} title="No plots on this site yet" action={canImport ? downloads : undefined}>
          <p>
            {canImport
              ? 'Draw them on the map, or fill in the template and import it below.'
              : "The coordinators haven't drawn the plots for this site yet."}
          </p>
        </EmptyState>
      </Card>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      {downloads}
      <DataTable
        data={plots.data.items}
        columns={columns}
        caption={`Plots on ${siteName}`}
        filterLabel="Filter plots"
        emptyMessage="No plots on this site yet."
        initialSorting={[{ id: 'label', desc: false }]}
        pageSizes={[25, 50, 100]}
        getRowId={(plot) => String(plot.id)}
      />
    </div>
  );
}
