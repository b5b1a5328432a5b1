import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { CloudRain, Droplets, ListChecks, Map as MapIcon, Pencil, Table2 } from 'lucide-react';
import { formatLength } from '@shared/geometry';
import type { Site } from '@shared/schemas/sites';
import { DataTable } from '@/components/ui/data-table';
import { paths } from '@/lib/paths';
import { formatFrostDates, formatSize, unitsLabels } from '../lib/format';

const linkClasses =
  'inline-flex min-h-11 items-center gap-1.5 rounded-md px-2 font-medium whitespace-nowrap hover:bg-paper-100';

function columnsFor(clubId: number): ColumnDef<Site>[] {
  return [
    {
      id: 'name',
      header: 'Name',
      accessorFn: (site) => `${site.name} ${site.address}`,
      sortingFn: (a, b) => a.original.name.localeCompare(b.original.name),
      cell: ({ row }) => (
        <div className="min-w-40">
          <Link to={paths.sitePlots(clubId, row.original.id)} className="inline-flex min-h-11 items-center font-semibold">
            {row.original.name}
          </Link>
          {row.original.address && <p className="text-sm text-stone">{row.original.address}</p>}
        </div>
      ),
    },
    {
      id: 'units',
      header: 'Units',
      accessorFn: (site) => unitsLabels[site.units],
      cell: ({ getValue }) => <span className="whitespace-nowrap">{getValue<string>()}</span>,
    },
    {
      id: 'plots',
      header: 'Plots',
      accessorFn: (site) => site.plotCount,
      enableGlobalFilter: false,
      cell: ({ getValue }) => <span className="tabular-nums">{getValue<number>()}</span>,
    },
    {
      id: 'pathWidth',
      header: 'Path width',
      accessorFn: (site) => site.pathWidth,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="whitespace-nowrap">{formatLength(row.original.pathWidth, row.original.units)}</span>,
    },
    {
      id: 'size',
      header: 'Size',
      // Sorted by ground area, which is what "bigger" means for a site.
      accessorFn: (site) => site.width * site.length,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <span className="whitespace-nowrap">{formatSize(row.original.width, row.original.length, row.original.units)}</span>
      ),
    },
    {
      id: 'frost',
      header: 'Frost dates',
      accessorFn: (site) => formatFrostDates(site.lastSpringFrost, site.firstAutumnFrost) ?? '',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ getValue }) => {
        const text = getValue<string>();
        return text ? (
          <span className="whitespace-nowrap" title="Last spring frost – first autumn frost">
            {text}
          </span>
        ) : (
          <span className="text-stone">Not set</span>
        );
      },
    },
    {
      id: 'open',
      header: 'Open',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) => {
        const site = row.original;
        return (
          <div className="-mx-2 -my-2 flex flex-wrap gap-x-1">
            <Link to={`${paths.map(clubId)}?site=${site.id}`} className={linkClasses} aria-label={`Map of ${site.name}`}>
              <MapIcon className="size-4" aria-hidden="true" />
              Map
            </Link>
            <Link to={paths.sitePlots(clubId, site.id)} className={linkClasses} aria-label={`Plots of ${site.name}`}>
              <Table2 className="size-4" aria-hidden="true" />
              Plots
            </Link>
            <Link to={paths.weather(clubId, site.id)} className={linkClasses} aria-label={`Weather at ${site.name}`}>
              <CloudRain className="size-4" aria-hidden="true" />
              Weather
            </Link>
            <Link to={paths.siteTasks(clubId, site.id)} className={linkClasses} aria-label={`Tasks at ${site.name}`}>
              <ListChecks className="size-4" aria-hidden="true" />
              Tasks
            </Link>
            <Link to={paths.siteWater(clubId, site.id)} className={linkClasses} aria-label={`Water at ${site.name}`}>
              <Droplets className="size-4" aria-hidden="true" />
              Water
            </Link>
            <Link to={paths.siteEdit(clubId, site.id)} className={linkClasses} aria-label={`Edit ${site.name}`}>
              <Pencil className="size-4" aria-hidden="true" />
              Edit
            </Link>
          </div>
        );
      },
    },
  ];
}

/** The club's sites with their size, units and frost dates, each linking to its map, plots and settings. */
export function SitesTable({ clubId, sites }: { clubId: number; sites: Site[] }) {
  const columns = useMemo(() => columnsFor(clubId), [clubId]);
  return (
    <DataTable
      data={sites}
      columns={columns}
      caption="Sites"
      filterLabel="Filter sites"
      emptyMessage="No sites yet."
      initialSorting={[{ id: 'name', desc: false }]}
      getRowId={(site) => String(site.id)}
    />
  );
}
