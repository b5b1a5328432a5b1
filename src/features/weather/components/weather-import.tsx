import { useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { ColumnDef } from '@tanstack/react-table';
import type { UnitSystem } from '@shared/geometry';
import { WeatherImportBodySchema, weatherCsvColumns, type WeatherImportResult } from '@shared/schemas/weather';
import { Alert } from '@/components/ui/alert';
import {
  checkColumn,
  CsvCheckSection,
  CsvFileField,
  CsvImportActions,
  csvProblemsOf,
  CsvRowsField,
  rowColumn,
  useCsvFile,
  type PreviewRow,
} from '@/components/ui/csv-import';
import { plural } from '@/lib/format';
import { useImportWeather } from '../api/import-weather';
import { weatherTemplateUrl } from '../api/weather-csv';
import { dayText, rainText, temperatureText } from '../lib/format';

const ImportFormSchema = WeatherImportBodySchema.omit({ commit: true });
interface ImportFormValues {
  csv: string;
  units: UnitSystem;
  duplicates: 'skip' | 'replace';
}

type Row = WeatherImportResult['rows'][number];

const statusWords: Record<NonNullable<Row['status']>, string> = {
  new: 'New day',
  replace: 'Replaces the stored day',
  skip: 'Skipped: the stored day stays',
};

/** The preview shows the file's values in the site's units, whatever units the file was in. */
function previewColumns(siteUnits: UnitSystem): ColumnDef<PreviewRow<Row>>[] {
  return [
    rowColumn<Row>(),
    {
      id: 'day',
      header: 'Day',
      accessorFn: (r) => r.day,
      cell: ({ row }) => <span className="font-medium whitespace-nowrap">{/^\d{4}-\d\d-\d\d$/.test(row.original.day) ? dayText(row.original.day) : row.original.day || '(no date)'}</span>,
    },
    {
      id: 'temperature',
      header: 'Temperature',
      accessorFn: (r) => (r.values ? (temperatureText(r.values, siteUnits) ?? '') : ''),
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ getValue }) => <span className="whitespace-nowrap tabular-nums">{getValue<string>() || '–'}</span>,
    },
    {
      id: 'rain',
      header: 'Rain',
      accessorFn: (r) => r.values?.rainMm ?? -1,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="whitespace-nowrap tabular-nums">{(row.original.values && rainText(row.original.values, siteUnits)) || '–'}</span>,
    },
    {
      id: 'status',
      header: 'What happens',
      accessorFn: (r) => (r.status ? statusWords[r.status] : ''),
      cell: ({ getValue }) => <span>{getValue<string>() || '–'}</span>,
    },
    checkColumn<Row>(),
  ];
}

interface Checked extends ImportFormValues {
  result: WeatherImportResult;
}

const countsText = (c: WeatherImportResult['counts']) =>
  `${plural(c.new, 'new day')}, ${plural(c.replaced, 'day')} replaced, ${plural(c.skipped, 'day')} skipped`;

export interface WeatherImportProps {
  siteId: number;
  siteName: string;
  siteUnits: UnitSystem;
}

/** Checks a weather CSV against the site's log, previews every day with its problems and what happens to it, and imports every row or none. */
export function WeatherImport({ siteId, siteName, siteUnits }: WeatherImportProps) {
  const check = useImportWeather(siteId);
  const commit = useImportWeather(siteId);
  const [checked, setChecked] = useState<Checked | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [imported, setImported] = useState<WeatherImportResult['counts'] | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const {
    register,
    control,
    handleSubmit,
    setValue,
    reset,
    formState: { errors },
  } = useForm<ImportFormValues>({
    resolver: zodResolver(ImportFormSchema),
    defaultValues: { csv: '', units: siteUnits, duplicates: 'skip' },
  });
  const file = useCsvFile((text) => setValue('csv', text, { shouldValidate: true, shouldDirty: true }));
  const [csv, units, duplicates] = useWatch({ control, name: ['csv', 'units', 'duplicates'] });
  // A preview belongs to the exact text, units and choice it was made from; any change means checking again.
  const current = checked && checked.csv === csv && checked.units === units && checked.duplicates === duplicates ? checked : null;
  const columns = useMemo(() => previewColumns(siteUnits), [siteUnits]);

  const onCheck = handleSubmit((values) => {
    setFormError(null);
    setImported(null);
    check.mutate(
      { ...values, commit: false },
      { onSuccess: (result) => setChecked({ ...values, result }), onError: (error) => setFormError(error.message) },
    );
  });

  const importAll = (values: ImportFormValues) => {
    setFormError(null);
    commit.mutate(
      { ...values, commit: true },
      {
        onSuccess: (result) => {
          setChecked(null);
          file.forget();
          if (fileInput.current) fileInput.current.value = '';
          reset({ csv: '', units: values.units, duplicates: values.duplicates });
          setImported(result.counts);
        },
        onError: (error) => {
          const problems = csvProblemsOf(error);
          if (problems && current) setChecked({ ...current, result: { ...current.result, errors: problems } });
          setFormError(error.message);
        },
      },
    );
  };

  const result = current?.result;
  const ready = result !== undefined && result.errors.length === 0 && result.rows.length > 0;
  const busy = check.isPending ? 'check' : commit.isPending ? 'commit' : null;
  const writes = result ? result.counts.new + result.counts.replaced : 0;

  return (
    <div className="flex flex-col gap-6">
      <p className="text-stone">
        Add many days at once from a spreadsheet or a weather station’s export saved as CSV, one day per row. Check the file first: you see
        every row and every problem. <strong className="font-semibold text-soil">Nothing is saved until every row is right.</strong>
      </p>

      {imported && (
        <Alert tone="success" title="Imported">
          {countsText(imported)}. The table above shows them.
        </Alert>
      )}
      {formError && <Alert tone="error">{formError}</Alert>}

      <form onSubmit={onCheck} noValidate className="flex flex-col gap-5">
        <CsvFileField
          inputRef={fileInput}
          fileName={file.fileName}
          error={file.fileError}
          templateUrl={weatherTemplateUrl(siteId, units)}
          onPick={(picked) => {
            setImported(null);
            void file.pick(picked);
          }}
        />
        <div className="grid gap-5 md:grid-cols-2">
          <fieldset>
            <legend className="mb-1.5 font-medium text-soil">Values in the file are in</legend>
            <div className="flex flex-col gap-1">
              <label className="flex min-h-11 cursor-pointer items-center gap-2">
                <input type="radio" value="metric" className="size-5 accent-leaf" {...register('units')} />
                °C, mm, m/s and metres
              </label>
              <label className="flex min-h-11 cursor-pointer items-center gap-2">
                <input type="radio" value="us" className="size-5 accent-leaf" {...register('units')} />
                °F, inches, mph and feet
              </label>
            </div>
            <p className="text-sm text-stone">Humidity in %, sunshine in hours and solar radiation in MJ/m² either way.</p>
          </fieldset>
          <fieldset>
            <legend className="mb-1.5 font-medium text-soil">A day the log already holds</legend>
            <div className="flex flex-col gap-1">
              <label className="flex min-h-11 cursor-pointer items-center gap-2">
                <input type="radio" value="skip" className="size-5 accent-leaf" {...register('duplicates')} />
                Keep what is stored (skip the row)
              </label>
              <label className="flex min-h-11 cursor-pointer items-center gap-2">
                <input type="radio" value="replace" className="size-5 accent-leaf" {...register('duplicates')} />
                Replace it with the file’s row
              </label>
            </div>
          </fieldset>
        </div>

        <CsvRowsField
          label="Day rows"
          hint={`The first line names the columns: date, then any of ${weatherCsvColumns.slice(1).join(', ')}. Dates look like 2026-06-03.`}
          error={errors.csv?.message}
          rows={8}
          registration={register('csv', { onChange: () => setImported(null) })}
        />

        <CsvImportActions
          busy={busy}
          ready={ready}
          importLabel={ready ? `Import ${plural(writes, 'day')}` : 'Import days'}
          onImport={() => void handleSubmit(importAll)()}
          note={
            busy
              ? busy === 'check'
                ? 'Checking every row against the log…'
                : 'Saving every row…'
              : ready
                ? `Every row is right: ${countsText(result.counts)}. Importing saves them all at once.`
                : result && result.errors.length > 0
                  ? 'Fix the problems listed below, then check again.'
                  : checked && !current
                    ? 'The rows, units or choice changed since the check. Check the file again.'
                    : 'Check the file first; importing opens up when every row is right.'
          }
        />
      </form>

      {result && (
        <CsvCheckSection
          result={result}
          columns={columns}
          readyTitle={result.rows.length === 1 ? 'The row is ready' : `All ${result.rows.length} rows are ready`}
          readyMessage={
            <>
              {countsText(result.counts)}. Nothing is saved yet. Import to add them to {siteName}’s log.
            </>
          }
          emptyMessage="The file has no day rows."
        />
      )}
    </div>
  );
}
