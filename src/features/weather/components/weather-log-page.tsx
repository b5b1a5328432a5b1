import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { CloudRain, Download, FileSpreadsheet, Pencil, Plus, Trash2 } from 'lucide-react';
import { addCalendarDays } from '@shared/dates';
import type { UnitSystem } from '@shared/geometry';
import { MAX_WEATHER_DAYS_PER_REQUEST, type WeatherDay, type WeatherLog } from '@shared/schemas/weather';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { Dialog } from '@/components/ui/dialog';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useDeleteWeatherDay } from '../api/delete-weather-day';
import { useWeatherLog } from '../api/get-weather-log';
import { weatherCsvUrl, weatherTemplateUrl } from '../api/weather-csv';
import { dayText, humidityText, rainText, sourceWords, sunText, temperatureText, unitsSentence, weekdayText, windText } from '../lib/format';
import { WeatherDayDialog } from './weather-day-dialog';
import { WeatherImport } from './weather-import';

/** The spans the log can show, worked out from the site's today. */
const periods = {
  recent: { label: 'The last 8 weeks', range: () => ({}) },
  quarter: { label: 'The last 13 weeks', range: (today: string) => ({ from: addCalendarDays(today, -90), to: today }) },
  season: {
    // The growing season as the demo and most northern sites count it (1 April – 31 October, common practice).
    label: 'This year’s growing season (April to October)',
    range: (today: string) => ({ from: `${today.slice(0, 4)}-04-01`, to: `${today.slice(0, 4)}-10-31` }),
  },
  year: {
    label: `The last ${MAX_WEATHER_DAYS_PER_REQUEST} days`,
    range: (today: string) => ({ from: addCalendarDays(today, -(MAX_WEATHER_DAYS_PER_REQUEST - 1)), to: today }),
  },
} as const;
type Period = keyof typeof periods;

const cellText = (text: string | null) => (text ? <span className="tabular-nums">{text}</span> : <span className="text-stone">–</span>);

function columnsFor(log: WeatherLog, act: { edit: (d: WeatherDay) => void; remove: (d: WeatherDay) => void }): ColumnDef<WeatherDay>[] {
  const units: UnitSystem = log.units;
  const columns: ColumnDef<WeatherDay>[] = [
    {
      id: 'day',
      header: 'Day',
      accessorFn: (d) => d.day,
      cell: ({ row }) => (
        <span className="font-semibold whitespace-nowrap">
          <span className="text-stone">{weekdayText(row.original.day)}</span> {dayText(row.original.day)}
        </span>
      ),
    },
    {
      id: 'temperature',
      header: 'Lowest to highest',
      accessorFn: (d) => d.tMaxC ?? undefined,
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: ({ row }) => cellText(temperatureText(row.original, units)),
    },
    {
      id: 'rain',
      header: 'Rain',
      accessorFn: (d) => d.rainMm ?? undefined,
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: ({ row }) => cellText(rainText(row.original, units)),
    },
    { id: 'humidity', header: 'Humidity', enableSorting: false, enableGlobalFilter: false, cell: ({ row }) => cellText(humidityText(row.original)) },
    { id: 'wind', header: 'Wind', enableSorting: false, enableGlobalFilter: false, cell: ({ row }) => cellText(windText(row.original, units)) },
    { id: 'sun', header: 'Sun', enableSorting: false, enableGlobalFilter: false, cell: ({ row }) => cellText(sunText(row.original)) },
    {
      id: 'source',
      header: 'From',
      accessorFn: (d) => `${sourceWords[d.source]} ${d.enteredByName ?? ''}`,
      cell: ({ row }) => (
        <span>
          {sourceWords[row.original.source]}
          {row.original.enteredByName && <span className="block text-sm text-stone">{row.original.enteredByName}</span>}
        </span>
      ),
    },
  ];
  if (log.canWrite) {
    columns.push({
      id: 'actions',
      header: 'Change',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) => (
        <div className="-my-2 flex gap-1">
          <Button variant="ghost" className="px-2" onClick={() => act.edit(row.original)}>
            <Pencil className="size-4" aria-hidden="true" />
            Edit <span className="sr-only">{dayText(row.original.day)}</span>
          </Button>
          {log.canDelete && (
            <Button variant="ghost" className="px-2" onClick={() => act.remove(row.original)}>
              <Trash2 className="size-4" aria-hidden="true" />
              Delete <span className="sr-only">{dayText(row.original.day)}</span>
            </Button>
          )}
        </div>
      ),
    });
  }
  return columns;
}

function DeleteDayDialog({ siteId, day, onClose, onDeleted }: { siteId: number; day: WeatherDay | null; onClose: () => void; onDeleted: (day: string) => void }) {
  const remove = useDeleteWeatherDay(siteId);
  const [error, setError] = useState<string | null>(null);
  const close = () => {
    setError(null);
    onClose();
  };
  return (
    <Dialog
      open={day !== null}
      onClose={close}
      title={day ? `Delete the weather for ${dayText(day.day)}?` : 'Delete the day?'}
      description={<p>Every value of the day goes, and it cannot be undone.</p>}
    >
      {error && <Alert tone="error">{error}</Alert>}
      <div className="flex flex-wrap gap-3">
        <Button
          variant="danger"
          loading={remove.isPending}
          loadingText="Deleting…"
          onClick={() =>
            day &&
            remove.mutate(day.day, {
              onSuccess: () => {
                setError(null);
                onDeleted(day.day);
              },
              onError: (e) => setError(e.message),
            })
          }
        >
          Yes, delete the day
        </Button>
        <Button variant="secondary" onClick={close} disabled={remove.isPending}>
          Keep it
        </Button>
      </div>
    </Dialog>
  );
}

export interface WeatherLogPageProps {
  clubId: number;
  site: { id: number; name: string; units: UnitSystem };
}

/** A site's weather log: a table of the days in the site's units, with editing, deleting, CSV files and the import. */
export function WeatherLogPage({ clubId, site }: WeatherLogPageProps) {
  const [period, setPeriod] = useState<Period>('recent');
  const [today, setToday] = useState<string | null>(null);
  const range = today ? periods[period].range(today) : {};
  const log = useWeatherLog(site.id, range);
  const [editing, setEditing] = useState<WeatherDay | 'new' | null>(null);
  const [deleting, setDeleting] = useState<WeatherDay | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  if (log.data && today !== log.data.today) setToday(log.data.today);

  const data = log.data;
  const columns = useMemo(
    () =>
      data
        ? columnsFor(data, {
            edit: (d) => {
              setNotice(null);
              setEditing(d);
            },
            remove: (d) => {
              setNotice(null);
              setDeleting(d);
            },
          })
        : [],
    [data],
  );

  const downloads = (
    <>
      <a href={weatherCsvUrl(site.id, site.units)} download className={buttonClasses('secondary')}>
        <Download className="size-5" aria-hidden="true" />
        Download CSV
      </a>
      <a href={weatherTemplateUrl(site.id, site.units)} download className={buttonClasses('secondary')}>
        <FileSpreadsheet className="size-5" aria-hidden="true" />
        Template
      </a>
    </>
  );

  let body;
  if (log.isPending) body = <LoadingState label="Loading the weather…" />;
  else if (log.isError) {
    body = (
      <ErrorState
        title="The weather log didn't load"
        message={log.error.message}
        requestId={isApiError(log.error) ? log.error.requestId : undefined}
        onRetry={() => void log.refetch()}
        retrying={log.isFetching}
      />
    );
  } else if (log.data.days.length === 0) {
    body = (
      <Card>
        <EmptyState
          icon={CloudRain}
          title="No weather logged for these days"
          action={
            log.data.canWrite && (
              <>
                <Link to={paths.rainGauge(clubId, site.id)} className={buttonClasses('primary')}>
                  <CloudRain className="size-5" aria-hidden="true" />
                  Log rain
                </Link>
                <Button variant="secondary" onClick={() => setEditing('new')}>
                  <Plus className="size-5" aria-hidden="true" />
                  Add a day
                </Button>
              </>
            )
          }
        >
          <p>
            {log.data.canWrite
              ? 'Log today’s rain from the gauge, type in a day, or import a station’s file below.'
              : 'Nobody has logged the weather here for these days. The site’s plot holders and coordinators can.'}
          </p>
        </EmptyState>
      </Card>
    );
  } else {
    body = (
      <DataTable
        data={log.data.days}
        columns={columns}
        caption={`Weather at ${site.name}`}
        filterLabel="Filter days"
        emptyMessage="No weather logged for these days."
        initialSorting={[{ id: 'day', desc: true }]}
        pageSizes={[14, 28, 100]}
        getRowId={(d) => d.day}
      />
    );
  }

  return (
    <>
      <title>{`Weather log · ${site.name} · Tillwell`}</title>
      <PageHeader
        eyebrow={site.name}
        title="Weather log"
        description={`Each day’s weather at ${site.name}, in ${unitsSentence(site.units)}. Days are the site’s own calendar days.`}
        actions={
          data?.canWrite && (
            <>
              <Link to={paths.rainGauge(clubId, site.id)} className={buttonClasses('primary')}>
                <CloudRain className="size-5" aria-hidden="true" />
                Log rain
              </Link>
              <Button variant="secondary" onClick={() => setEditing('new')}>
                <Plus className="size-5" aria-hidden="true" />
                Add a day
              </Button>
            </>
          )
        }
      />
      <div className="flex flex-col gap-6">
        <div className="flex flex-col gap-3 sm:flex-row sm:items-end sm:justify-between">
          <Select label="Show" value={period} onChange={(event) => setPeriod(event.target.value as Period)} className="sm:max-w-xs" disabled={!today}>
            {Object.entries(periods).map(([key, p]) => (
              <option key={key} value={key}>
                {p.label}
              </option>
            ))}
          </Select>
          <div className="flex flex-wrap gap-3">{downloads}</div>
        </div>
        {log.isFetching && !log.isPending && (
          <LoadingState inline label="Loading those days…" />
        )}
        {notice && <Alert tone="success">{notice}</Alert>}
        <section aria-label="Days" className="min-w-0">
          {body}
        </section>
        {data?.canWrite && (
          <section aria-labelledby="import-weather" className="min-w-0">
            <h2 id="import-weather" className="mb-4 text-xl font-semibold">
              Import days from a CSV file
            </h2>
            <Card>
              <WeatherImport siteId={site.id} siteName={site.name} siteUnits={site.units} />
            </Card>
          </section>
        )}
      </div>
      {data && (
        <WeatherDayDialog
          siteId={site.id}
          units={data.units}
          timeZone={data.timeZone}
          today={data.today}
          day={editing === 'new' ? null : editing}
          open={editing !== null}
          onClose={() => setEditing(null)}
          onSaved={(saved) => {
            setEditing(null);
            setNotice(`Saved the weather for ${dayText(saved.day)}.`);
          }}
        />
      )}
      <DeleteDayDialog
        siteId={site.id}
        day={deleting}
        onClose={() => setDeleting(null)}
        onDeleted={(day) => {
          setDeleting(null);
          setNotice(`Deleted the weather for ${dayText(day)}.`);
        }}
      />
    </>
  );
}
