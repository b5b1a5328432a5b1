import { useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { ColumnDef } from '@tanstack/react-table';
import { lengthUnitLabel, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import { PlotImportBodySchema, plotKindLabels, sunLabels, type PlotImportResult } from '@shared/schemas/plots';
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
import { useImportPlots } from '../api/import-plots';
import { formatSize } from '../lib/format';

const ImportFormSchema = PlotImportBodySchema.omit({ commit: true });
interface ImportFormValues {
  csv: string;
  units: UnitSystem;
}

type Row = PlotImportResult['rows'][number];

function previewColumns(units: UnitSystem): ColumnDef<PreviewRow<Row>>[] {
  const unit = lengthUnitLabel(units);
  const show = (m: number) => String(roundTo(toDisplayLength(m, units), 2));
  return [
    rowColumn<Row>(),
    {
      id: 'label',
      header: 'Label',
      accessorFn: (r) => r.label,
      sortingFn: 'alphanumeric',
      cell: ({ row }) => <span className="font-medium whitespace-nowrap">{row.original.label || '(no label)'}</span>,
    },
    {
      id: 'position',
      header: `Corner (${unit})`,
      accessorFn: (r) => (r.plot ? `${show(r.plot.x)}, ${show(r.plot.y)}` : ''),
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ getValue }) => <span className="whitespace-nowrap tabular-nums">{getValue<string>() || '–'}</span>,
    },
    {
      id: 'size',
      header: 'Size',
      accessorFn: (r) => (r.plot ? formatSize(r.plot.width, r.plot.length, units) : ''),
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ getValue }) => <span className="whitespace-nowrap tabular-nums">{getValue<string>() || '–'}</span>,
    },
    {
      id: 'kind',
      header: 'Kind',
      accessorFn: (r) => (r.plot ? plotKindLabels[r.plot.kind] : ''),
      cell: ({ getValue }) => <span className="whitespace-nowrap">{getValue<string>() || '–'}</span>,
    },
    {
      id: 'sun',
      header: 'Sun',
      accessorFn: (r) => (r.plot ? sunLabels[r.plot.sun] : ''),
      cell: ({ getValue }) => <span className="whitespace-nowrap">{getValue<string>() || '–'}</span>,
    },
    checkColumn<Row>(),
  ];
}

interface Checked {
  csv: string;
  units: UnitSystem;
  result: PlotImportResult;
}

export interface PlotImportProps {
  siteId: number;
  siteName: string;
  siteUnits: UnitSystem;
  onImported?: (count: number) => void;
}

/** Checks a plot CSV against the site, previews it with every problem by row, and imports all rows or none. */
export function PlotImport({ siteId, siteName, siteUnits, onImported }: PlotImportProps) {
  const check = useImportPlots(siteId);
  const commit = useImportPlots(siteId);
  const [checked, setChecked] = useState<Checked | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [imported, setImported] = useState<number | null>(null);
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
    defaultValues: { csv: '', units: siteUnits },
  });
  const file = useCsvFile((text) => setValue('csv', text, { shouldValidate: true, shouldDirty: true }));
  const csv = useWatch({ control, name: 'csv' });
  const units = useWatch({ control, name: 'units' });
  // A preview belongs to the exact text and units it was made from; any edit means checking again.
  const current = checked && checked.csv === csv && checked.units === units ? checked : null;
  const previewUnits = current?.units ?? units;
  const columns = useMemo(() => previewColumns(previewUnits), [previewUnits]);

  const onCheck = handleSubmit((values) => {
    setFormError(null);
    setImported(null);
    check.mutate(
      { ...values, commit: false },
      {
        onSuccess: (result) => setChecked({ ...values, result }),
        onError: (error) => setFormError(error.message),
      },
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
          reset({ csv: '', units: values.units });
          setImported(result.created);
          onImported?.(result.created);
        },
        onError: (error) => {
          // The site changed after the check (say, a plot drawn on the map): show the fresh problems.
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

  return (
    <div className="flex flex-col gap-6">
      <p className="text-stone">
        Add many plots at once from a spreadsheet saved as CSV, one plot per row. Check the file first: you see every row
        and every problem. <strong className="font-semibold text-soil">Nothing is saved until every row is right.</strong>
      </p>

      {imported !== null && (
        <Alert tone="success" title={`Imported ${imported} ${imported === 1 ? 'plot' : 'plots'}`}>
          They are on the map of {siteName} and in the table above.
        </Alert>
      )}
      {formError && <Alert tone="error">{formError}</Alert>}

      <form onSubmit={onCheck} noValidate className="flex flex-col gap-5">
        <div className="grid gap-5 md:grid-cols-2">
          <CsvFileField
            inputRef={fileInput}
            fileName={file.fileName}
            error={file.fileError}
            onPick={(picked) => {
              setImported(null);
              void file.pick(picked);
            }}
          />

          <fieldset>
            <legend className="mb-1.5 font-medium text-soil">Lengths in the file are in</legend>
            <div className="flex flex-col gap-1 sm:flex-row sm:gap-6">
              <label className="flex min-h-11 cursor-pointer items-center gap-2">
                <input type="radio" value="metric" className="size-5 accent-leaf" {...register('units')} />
                Metres (soil depth in m)
              </label>
              <label className="flex min-h-11 cursor-pointer items-center gap-2">
                <input type="radio" value="us" className="size-5 accent-leaf" {...register('units')} />
                Feet (soil depth in inches)
              </label>
            </div>
          </fieldset>
        </div>

        <CsvRowsField
          label="Plot rows"
          hint="The first line names the columns: label, x, y, width, length, then any of rotation, kind, soil_depth, soil_ph, soil_tested_on, sun, accessible, water_tap, notes."
          error={errors.csv?.message}
          rows={8}
          registration={register('csv', { onChange: () => setImported(null) })}
        />

        <CsvImportActions
          busy={busy}
          ready={ready}
          importLabel={ready ? `Import ${result.rows.length} ${result.rows.length === 1 ? 'plot' : 'plots'}` : 'Import plots'}
          onImport={() => void handleSubmit(importAll)()}
          note={
            busy
              ? busy === 'check'
                ? 'Checking every row against the site…'
                : 'Saving every row…'
              : ready
                ? 'Every row is right. Importing saves them all at once.'
                : result && result.errors.length > 0
                  ? 'Fix the problems listed below, then check again.'
                  : checked && !current
                    ? 'The rows or units changed since the check. Check the file again.'
                    : 'Check the file first; importing opens up when every row is right.'
          }
        />
      </form>

      {result && (
        <CsvCheckSection
          result={result}
          columns={columns}
          readyTitle={`All ${result.rows.length} rows are ready`}
          readyMessage={<>Nothing is saved yet. Import to add them to {siteName}.</>}
          emptyMessage="The file has no plot rows."
        />
      )}
    </div>
  );
}
