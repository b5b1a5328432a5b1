import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { Wheat } from 'lucide-react';
import { formatArea, SQUARE_METRES_PER_SQUARE_FOOT, type UnitSystem } from '@shared/geometry';
import { formatWeight } from '@shared/plot-book';
import type { HarvestFigure, HarvestFigures } from '@shared/schemas/harvest-figures';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useHarvestFigures } from '../api/get-harvest-figures';

function readYear(value: string | null): number | undefined {
  return value && /^\d{4}$/.test(value) ? Number(value) : undefined;
}

const areaUnit = (units: UnitSystem) => (units === 'us' ? 'ft²' : 'm²');

/** Grams per m² shown per the site's unit of area: a US-units site reads weight per ft². */
function formatPerArea(gramsPerM2: number | null, units: UnitSystem): string {
  if (gramsPerM2 === null) return '—';
  const perUnit = units === 'us' ? gramsPerM2 * SQUARE_METRES_PER_SQUARE_FOOT : gramsPerM2;
  return `${formatWeight(perUnit, units)} / ${areaUnit(units)}`;
}

const formatPerPlant = (grams: number | null, units: UnitSystem) => (grams === null ? '—' : formatWeight(grams, units));

function columnsFor(clubId: number, units: UnitSystem): ColumnDef<HarvestFigure>[] {
  const numeric = (text: string) => <span className="tabular-nums">{text}</span>;
  return [
    {
      id: 'crop',
      header: 'Crop',
      accessorFn: (f) => f.crop.commonName,
      cell: ({ row }) => (
        <Link to={paths.crop(clubId, row.original.crop.id)} className="inline-flex min-h-11 min-w-11 items-center font-semibold">
          {row.original.crop.commonName}
        </Link>
      ),
    },
    { id: 'plantings', header: 'Plantings', accessorFn: (f) => f.plantings, enableGlobalFilter: false, cell: ({ row }) => numeric(String(row.original.plantings)) },
    { id: 'area', header: 'Area', accessorFn: (f) => f.areaM2, enableGlobalFilter: false, cell: ({ row }) => numeric(formatArea(row.original.areaM2, units, 1)) },
    { id: 'plants', header: 'Plants', accessorFn: (f) => f.plants, enableGlobalFilter: false, cell: ({ row }) => numeric(row.original.plants ? String(row.original.plants) : '—') },
    {
      id: 'weight',
      header: 'Total weight',
      accessorFn: (f) => f.grams,
      enableGlobalFilter: false,
      // A crop picked only by count was never weighed: "0 g" would read as a failed crop.
      cell: ({ row }) => numeric(row.original.grams > 0 ? formatWeight(row.original.grams, units) : 'Not weighed'),
    },
    { id: 'count', header: 'Pieces', accessorFn: (f) => f.count, enableGlobalFilter: false, cell: ({ row }) => numeric(row.original.count ? String(row.original.count) : '—') },
    {
      id: 'perArea',
      header: `Per ${areaUnit(units)}`,
      accessorFn: (f) => f.gramsPerM2 ?? -1,
      enableGlobalFilter: false,
      cell: ({ row }) => numeric(row.original.grams > 0 ? formatPerArea(row.original.gramsPerM2, units) : '—'),
    },
    {
      id: 'perPlant',
      header: 'Per plant',
      accessorFn: (f) => f.gramsPerPlant ?? -1,
      enableGlobalFilter: false,
      cell: ({ row }) => numeric(row.original.grams > 0 ? formatPerPlant(row.original.gramsPerPlant, units) : '—'),
    },
  ];
}

const ROW = 46;

/** Total weight per crop as horizontal bars; each bar's crop and figure are written above it, so the colour carries nothing alone. */
function WeightChart({ items, units }: { items: HarvestFigure[]; units: UnitSystem }) {
  const shown = items.filter((f) => f.grams > 0);
  if (shown.length === 0) return <p className="text-stone">No harvest was weighed this season.</p>;
  const max = Math.max(...shown.map((f) => f.grams));
  const height = shown.length * ROW;
  return (
    <svg width="100%" height={height} role="img" aria-label={`Total weight per crop: ${shown.map((f) => `${f.crop.commonName} ${formatWeight(f.grams, units)}`).join(', ')}`}>
      {shown.map((f, i) => {
        const y = i * ROW;
        const pct = Math.max(1, (f.grams / max) * 100);
        return (
          <g key={f.crop.id} aria-hidden="true">
            <text x="0" y={y + 15} className="fill-soil text-sm">
              <tspan className="font-semibold">{f.crop.commonName}</tspan>
              <tspan dx="8" className="tabular-nums">{formatWeight(f.grams, units)}</tspan>
            </text>
            <rect x="0" y={y + 22} width={`${pct}%`} height="16" rx="3" className="fill-leaf" />
          </g>
        );
      })}
    </svg>
  );
}

function Totals({ data }: { data: HarvestFigures }) {
  const t = data.totals;
  const entries: Array<[string, string]> = [
    ['Crops', String(data.total)],
    ['Plantings', String(t.plantings)],
    ['Area planted', formatArea(t.areaM2, data.units, 1)],
    ['Total weight', formatWeight(t.grams, data.units)],
    [`Per ${areaUnit(data.units)}`, formatPerArea(t.gramsPerM2, data.units)],
    ['Pieces counted', String(t.count)],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
      {entries.map(([label, value]) => (
        <div key={label} className="rounded-lg border border-paper-200 bg-white p-3">
          <dt className="text-sm text-stone">{label}</dt>
          <dd className="text-lg font-semibold tabular-nums">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The club's harvest figures for a season: totals, a bar per crop and a sortable table, in the main site's units. */
export function HarvestsPage({ clubId, clubName }: { clubId: number; clubName: string }) {
  const [params, setParams] = useSearchParams();
  const year = readYear(params.get('year'));
  const figures = useHarvestFigures({ clubId, year });
  const units = figures.data?.units ?? 'metric';
  const columns = useMemo(() => columnsFor(clubId, units), [clubId, units]);

  const pickYear = (value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set('year', value);
    else next.delete('year');
    setParams(next, { replace: true });
  };

  let body;
  if (figures.isPending) body = <LoadingState label="Loading the harvest figures…" />;
  else if (figures.isError) {
    body = (
      <ErrorState
        message={figures.error.message}
        requestId={isApiError(figures.error) ? figures.error.requestId : undefined}
        onRetry={() => void figures.refetch()}
        retrying={figures.isFetching}
      />
    );
  } else if (!figures.data.season) {
    body = (
      <Card>
        <EmptyState icon={Wheat} title="No season yet">
          <p>Harvest figures appear once the club has a season and its plot holders record plantings and harvests.</p>
        </EmptyState>
      </Card>
    );
  } else {
    const data = figures.data;
    const season = data.season!;
    body = (
      <div className="flex flex-col gap-6">
        <Select label="Season" value={String(season.year)} onChange={(e) => pickYear(e.target.value)} className="sm:w-48">
          {data.years.map((y) => (
            <option key={y} value={y}>
              {y}
            </option>
          ))}
        </Select>
        {data.items.length === 0 ? (
          <Card>
            <EmptyState icon={Wheat} title={`Nothing planted in ${season.year} yet`}>
              <p>Plantings and harvests recorded in the plot books of {season.year} are added up here, per crop.</p>
            </EmptyState>
          </Card>
        ) : (
          <>
            <Totals data={data} />
            <PageSection id="harvest-chart" title={`Total weight per crop, ${season.year}`}>
              <Card>
                <WeightChart items={data.items} units={units} />
              </Card>
            </PageSection>
            <PageSection id="harvest-table" title={`Figures per crop, ${season.year}`}>
              <DataTable
                data={data.items}
                columns={columns}
                caption={`Harvest figures per crop, ${season.year}`}
                filterLabel="Search by crop"
                emptyMessage="No crop by that name this season."
                initialSorting={[{ id: 'weight', desc: true }]}
                pageSizes={[50, 100]}
                getRowId={(f) => String(f.crop.id)}
              />
            </PageSection>
          </>
        )}
      </div>
    );
  }

  return (
    <>
      <title>{`Harvests · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Harvests"
        description="What the club grew and picked in a season, per crop, added up from every plot book: weight, pieces, per area and per plant. It names nobody."
      />
      {body}
    </>
  );
}
