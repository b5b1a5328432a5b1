import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { CloudRain, Droplets, ListChecks, Sprout } from 'lucide-react';
import { formatArea, type UnitSystem } from '@shared/geometry';
import type { WaterSummary } from '@shared/schemas/tasks';
import { Alert } from '@/components/ui/alert';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { joinWords } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useWater, WATER_WEEKS } from '../api/get-water';
import { addDaysTo, taskWindow } from '../lib/dates';
import { formatDepth, formatVolume, volumeUnitWords } from '../lib/units';
import { currentWeek, methodWords, ruleOfThumbWords } from '../lib/water';
import { WaterChart } from './water-chart';

type PlotRow = WaterSummary['plots'][number];

function plotColumns(units: UnitSystem): ColumnDef<PlotRow>[] {
  return [
    {
      id: 'plot',
      header: 'Plot',
      accessorFn: (p) => p.plotLabel,
      sortingFn: (a, b) => a.original.plotLabel.localeCompare(b.original.plotLabel, 'en', { numeric: true }),
      cell: ({ getValue }) => <span className="font-semibold whitespace-nowrap">{getValue<string>()}</span>,
    },
    { id: 'crops', header: 'In the ground', enableSorting: false, accessorFn: (p) => joinWords(p.crops), cell: ({ getValue }) => <span className="block sm:min-w-40">{getValue<string>()}</span> },
    {
      id: 'area',
      header: 'Area planted',
      accessorFn: (p) => p.areaM2,
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="whitespace-nowrap tabular-nums">{formatArea(row.original.areaM2, units, 1)}</span>,
    },
    { id: 'need', header: 'Need', accessorFn: (p) => p.needMm, enableSorting: false, enableGlobalFilter: false, cell: ({ row }) => <span className="tabular-nums">{formatDepth(row.original.needMm, units)}</span> },
    { id: 'rain', header: 'Rain logged', accessorFn: (p) => p.rainMm, enableSorting: false, enableGlobalFilter: false, cell: ({ row }) => <span className="tabular-nums">{formatDepth(row.original.rainMm, units)}</span> },
    {
      id: 'deficit',
      header: 'Deficit',
      accessorFn: (p) => p.deficitMm,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="tabular-nums">{formatDepth(row.original.deficitMm, units)}</span>,
    },
    {
      id: 'water',
      header: 'To water',
      accessorFn: (p) => p.litres,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="font-semibold whitespace-nowrap tabular-nums">{formatVolume(row.original.litres, units)}</span>,
    },
  ];
}

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="flex flex-col gap-1 rounded-xl border border-paper-200 bg-white p-4">
      <dt className="text-sm font-medium text-stone">{label}</dt>
      <dd className="text-2xl font-bold tabular-nums">{value}</dd>
      {note && <dd className="text-sm text-stone">{note}</dd>}
    </div>
  );
}

/** How the numbers are worked out, in our own short words, in the site's units. */
function WaterHelp({ units }: { units: UnitSystem }) {
  const us = units === 'us';
  return (
    <div className="flex max-w-prose flex-col gap-3">
      <p>
        <strong>Need.</strong> Each planting needs its crop coefficient (<abbr title="crop coefficient">Kc</abbr>) times the reference
        evapotranspiration (<abbr title="reference evapotranspiration">ET0</abbr>) for every day it is in the ground, the method of the FAO’s
        Irrigation and Drainage Paper 56 (FAO-56). ET0 is the water a well-watered field of short grass would give off that day; Kc scales it to
        the crop and its stage: low after sowing, highest in full leaf, lower again as it ripens. Raised beds and containers dry faster, so their
        need is multiplied by the club’s bed factor.
      </p>
      <p>
        <strong>ET0.</strong> A day with temperatures, humidity, wind and sunshine in the weather log is worked out with FAO-56 Penman-Monteith;
        a day with only temperatures with Hargreaves (FAO-56 Eq. 52). A day with no temperatures falls back on the rule of thumb of{' '}
        {ruleOfThumbWords(units)}, rain included: a rule of thumb, not a computation, and not scaled by Kc. Days still to come this week are
        estimated from the past week’s log.
      </p>
      <p>
        <strong>Rain and deficit.</strong> Rain counts as logged; a day with nothing logged counts as dry, so log the gauge. The deficit is the
        need less the rain, never below nothing, and the water to give is the deficit over the area planted:{' '}
        {us ? '1 inch over 1 square foot is about 0.62 US gallons.' : '1 mm over 1 m² is 1 litre.'}
      </p>
    </div>
  );
}

export interface WaterPageProps {
  clubId: number;
  site: { id: number; name: string; units: UnitSystem };
  /** Coordinators also get the link to the site's tasks table. */
  isCoordinator: boolean;
}

/**
 * A site's water for every member: this week's need, rain logged and deficit, per plot in litres (US gallons on US
 * sites) and how ET0 was worked out; then the past weeks as a chart with a table, and what the numbers mean.
 */
export function WaterPage({ clubId, site, isCoordinator }: WaterPageProps) {
  const water = useWater(site.id);
  const units = water.data?.units ?? site.units;
  const columns = useMemo(() => plotColumns(units), [units]);

  const header = (
    <>
      <title>{`Water · ${site.name} · Tillwell`}</title>
      <PageHeader
        eyebrow={site.name}
        title={`Water at ${site.name}`}
        description="How much water the plantings need this week, what the rain logged gives them, and what is left to water."
        actions={
          <>
            <Link to={paths.rainGauge(clubId, site.id)} className={buttonClasses('primary')}>
              <CloudRain className="size-5" aria-hidden="true" />
              Log rain
            </Link>
            <Link to={paths.weather(clubId, site.id)} className={buttonClasses('secondary')}>
              Weather log
            </Link>
            {isCoordinator && (
              <Link to={paths.siteTasks(clubId, site.id, '?kind=water')} className={buttonClasses('secondary')}>
                <ListChecks className="size-5" aria-hidden="true" />
                Watering tasks
              </Link>
            )}
          </>
        }
      />
    </>
  );

  if (water.isPending) {
    return (
      <>
        {header}
        <LoadingState label="Working out the water…" />
      </>
    );
  }
  if (water.isError) {
    return (
      <>
        {header}
        <ErrorState
          title="The water didn't load"
          message={water.error.message}
          requestId={isApiError(water.error) ? water.error.requestId : undefined}
          onRetry={() => void water.refetch()}
          retrying={water.isFetching}
        />
      </>
    );
  }

  const data = water.data;
  const week = currentWeek(data.weeks, data.today);
  const weekSpan = week ? taskWindow(week.weekStart, addDaysTo(week.weekStart, 6), data.today) : '';

  return (
    <>
      {header}
      <div className="flex flex-col gap-8">
        <PageSection id="water-this-week" title={week ? `This week, ${weekSpan}` : 'This week'}>
          {week ? (
            <div className="flex flex-col gap-4">
              <dl className="grid grid-cols-2 gap-3 lg:grid-cols-4">
                <Figure label="Need" value={formatDepth(week.needMm, units)} note="on average over the area planted" />
                <Figure label="Rain logged" value={formatDepth(week.rainMm, units)} note="so far this week" />
                <Figure label="Deficit" value={formatDepth(Math.max(0, week.deficitMm), units)} note="need less rain" />
                <Figure label="To water" value={formatVolume(week.litres, units)} note={`in ${volumeUnitWords(units)}, for the whole area planted`} />
              </dl>
              <p className="text-stone">
                <span className="font-medium text-soil">ET0 worked out by:</span> {methodWords(week.methods)} so far this week.
              </p>
            </div>
          ) : (
            <p className="text-stone">No weeks to show yet.</p>
          )}
        </PageSection>

        <PageSection id="water-plots" title="Plot by plot">
          {data.plots.length === 0 ? (
            <Card>
              <EmptyState icon={Sprout} title="Nothing in the ground this week" headingLevel="h3">
                <p>No planting at {site.name} is in the ground this week, so there is nothing to water. Plantings appear here from their plot books.</p>
              </EmptyState>
            </Card>
          ) : (
            <DataTable
              data={data.plots}
              columns={columns}
              caption={`Water per plot at ${site.name} this week`}
              filterLabel="Find a plot or crop"
              emptyMessage="No plot needs water this week."
              initialSorting={[{ id: 'plot', desc: false }]}
              pageSizes={[25, 50, 100]}
              getRowId={(p) => String(p.plotId)}
            />
          )}
        </PageSection>

        <PageSection id="water-weeks" title={`The last ${WATER_WEEKS} weeks`}>
          <Card>
            <WaterChart weeks={data.weeks} units={units} today={data.today} />
          </Card>
        </PageSection>

        <PageSection id="water-help" title="What the numbers mean">
          <Card className="flex flex-col gap-4">
            <WaterHelp units={units} />
            <Alert tone="warning" announce={false} title="Take care when watering">
              In hot weather water early or late and drink water yourself. A full can is heavy ({units === 'us' ? 'about 8 lb a US gallon' : 'about 1 kg a litre'}):
              fill it only as full as you can carry and lift with bent knees. Follow any local watering rules or hosepipe bans.
            </Alert>
            <p className="flex items-start gap-2 text-sm text-stone">
              <Droplets className="mt-0.5 size-4 shrink-0 text-water-700" aria-hidden="true" />
              These are estimates from the log, not readings of the soil: push a finger into the bed, and if it is still moist{' '}
              {units === 'us' ? 'an inch or two' : 'a few centimetres'} down, wait.
            </p>
          </Card>
        </PageSection>
      </div>
    </>
  );
}
