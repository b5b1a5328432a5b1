import { useId, useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { ColumnDef } from '@tanstack/react-table';
import { FileCheck, Upload } from 'lucide-react';
import { lengthUnitLabel, roundTo, toDisplayLength, type UnitSystem } from '@shared/geometry';
import { PlotImportBodySchema, plotKindLabels, sunLabels, type PlotImportResult } from '@shared/schemas/plots';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { Field, inputClasses } from '@/components/ui/field';
import { importErrorsOf, useImportPlots } from '../api/import-plots';
import { formatSize } from '../lib/format';

const ImportFormSchema = PlotImportBodySchema.omit({ commit: true });
interface ImportFormValues {
  csv: string;
  units: UnitSystem;
}

// The server takes at most 2,000,000 characters (PlotImportBodySchema); a bigger file is refused here at once.
const MAX_FILE_BYTES = 2_000_000;

type PreviewRow = PlotImportResult['rows'][number] & { problems: number };
type ImportError = PlotImportResult['errors'][number];

/** "Row 4, width: Must be more than 0", or "Row 1: The file has no header line" for a whole-row problem. */
export function importErrorText(error: ImportError): string {
  return error.field ? `Row ${error.row}, ${error.field}: ${error.message}` : `Row ${error.row}: ${error.message}`;
}

function previewColumns(units: UnitSystem): ColumnDef<PreviewRow>[] {
  const unit = lengthUnitLabel(units);
  const show = (m: number) => String(roundTo(toDisplayLength(m, units), 2));
  return [
    { id: 'row', header: 'Row', accessorFn: (r) => r.row, enableGlobalFilter: false },
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
    {
      id: 'status',
      header: 'Check',
      accessorFn: (r) => (r.problems > 0 ? 'Needs fixing' : 'Ready'),
      cell: ({ row }) =>
        row.original.problems > 0 ? (
          <Badge tone="straw">
            {row.original.problems === 1 ? '1 problem' : `${row.original.problems} problems`}
          </Badge>
        ) : (
          <Badge tone="leaf">Ready</Badge>
        ),
    },
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
  const ids = useId();
  const [checked, setChecked] = useState<Checked | null>(null);
  const [fileName, setFileName] = useState<string | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
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
  const csv = useWatch({ control, name: 'csv' });
  const units = useWatch({ control, name: 'units' });
  // A preview belongs to the exact text and units it was made from; any edit means checking again.
  const current = checked && checked.csv === csv && checked.units === units ? checked : null;
  const previewUnits = current?.units ?? units;
  const columns = useMemo(() => previewColumns(previewUnits), [previewUnits]);

  const rows: PreviewRow[] = useMemo(() => {
    if (!current) return [];
    const counts = new Map<number, number>();
    for (const e of current.result.errors) counts.set(e.row, (counts.get(e.row) ?? 0) + 1);
    return current.result.rows.map((r) => ({ ...r, problems: counts.get(r.row) ?? 0 }));
  }, [current]);

  const pickFile = async (file: File | undefined) => {
    setFileError(null);
    setImported(null);
    if (!file) return;
    if (file.size > MAX_FILE_BYTES) {
      setFileError('The file is larger than 2 MB; split it into smaller files.');
      return;
    }
    setFileName(file.name);
    setValue('csv', await file.text(), { shouldValidate: true, shouldDirty: true });
  };

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
          setFileName(null);
          if (fileInput.current) fileInput.current.value = '';
          reset({ csv: '', units: values.units });
          setImported(result.created);
          onImported?.(result.created);
        },
        onError: (error) => {
          // The site changed after the check (say, a plot drawn on the map): show the fresh problems.
          const problems = importErrorsOf(error);
          if (problems && current) setChecked({ ...current, result: { ...current.result, errors: problems } });
          setFormError(error.message);
        },
      },
    );
  };

  const result = current?.result;
  const ready = result !== undefined && result.errors.length === 0 && result.rows.length > 0;
  const badRows = result ? new Set(result.errors.map((e) => e.row)).size : 0;
  const busy = check.isPending || commit.isPending;
  const fileId = `${ids}-file`;

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
          <div className="flex flex-col gap-1.5">
            <label htmlFor={fileId} className="font-medium text-soil">
              CSV file
            </label>
            <input
              ref={fileInput}
              id={fileId}
              type="file"
              accept=".csv,text/csv"
              aria-describedby={fileError ? `${fileId}-error` : `${fileId}-hint`}
              aria-invalid={fileError ? true : undefined}
              className={`${inputClasses} cursor-pointer file:mr-3 file:rounded-md file:border-0 file:bg-paper-100 file:px-3 file:py-1 file:font-medium file:text-soil`}
              onChange={(event) => void pickFile(event.target.files?.[0])}
            />
            {fileError ? (
              <p id={`${fileId}-error`} className="text-sm font-medium text-clay-700">
                {fileError}
              </p>
            ) : (
              <p id={`${fileId}-hint`} className="text-sm text-stone">
                {fileName ? `Loaded ${fileName} into the box below.` : 'Or paste the rows into the box below.'}
              </p>
            )}
          </div>

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

        <Field
          label="Plot rows"
          hint="The first line names the columns: label, x, y, width, length, then any of rotation, kind, soil_depth, soil_ph, soil_tested_on, sun, accessible, water_tap, notes."
          error={errors.csv?.message}
        >
          {({ inputId, describedBy, invalid }) => (
            <textarea
              id={inputId}
              aria-describedby={describedBy}
              aria-invalid={invalid || undefined}
              rows={8}
              spellCheck={false}
              wrap="off"
              className={`${inputClasses} font-mono text-sm`}
              {...register('csv', { onChange: () => setImported(null) })}
            />
          )}
        </Field>

        <div className="flex flex-wrap gap-3">
          <Button type="submit" variant="secondary" loading={check.isPending} loadingText="Checking…" disabled={busy}>
            <FileCheck className="size-5" aria-hidden="true" />
            Check file
          </Button>
          <Button
            onClick={() => void handleSubmit(importAll)()}
            loading={commit.isPending}
            loadingText="Importing…"
            disabled={!ready || busy}
            aria-describedby={`${ids}-import-note`}
          >
            <Upload className="size-5" aria-hidden="true" />
            {ready ? `Import ${result.rows.length} ${result.rows.length === 1 ? 'plot' : 'plots'}` : 'Import plots'}
          </Button>
        </div>
        <p id={`${ids}-import-note`} className="-mt-2 text-sm text-stone" aria-live="polite">
          {busy
            ? check.isPending
              ? 'Checking every row against the site…'
              : 'Saving every row…'
            : ready
              ? 'Every row is right. Importing saves them all at once.'
              : result && result.errors.length > 0
                ? 'Fix the problems listed below, then check again.'
                : checked && !current
                ? 'The rows or units changed since the check. Check the file again.'
                : 'Check the file first; importing opens up when every row is right.'}
        </p>
      </form>

      {result && (
        <section aria-labelledby={`${ids}-preview`} className="flex min-w-0 flex-col gap-4">
          <h3 id={`${ids}-preview`} className="text-lg font-semibold">
            Check result
          </h3>
          {result.errors.length > 0 ? (
            <Alert
              tone="warning"
              title={
                badRows > 0
                  ? `${badRows} ${badRows === 1 ? 'row needs' : 'rows need'} fixing`
                  : 'The file needs fixing'
              }
            >
              <p>Nothing is saved until every row is right. Fix these in the file or in the box above, then check again.</p>
              <ul className="mt-2 list-disc pl-5" aria-label="Problems by row">
                {result.errors.map((e, i) => (
                  <li key={`${e.row}-${e.field}-${i}`}>{importErrorText(e)}</li>
                ))}
              </ul>
            </Alert>
          ) : (
            <Alert tone="info" title={`All ${result.rows.length} rows are ready`}>
              Nothing is saved yet. Import to add them to {siteName}.
            </Alert>
          )}
          {rows.length > 0 && (
            <DataTable
              data={rows}
              columns={columns}
              caption="Rows read from the file"
              filterLabel="Filter rows"
              emptyMessage="The file has no plot rows."
              initialSorting={[{ id: 'row', desc: false }]}
              pageSizes={[10, 25, 100]}
              getRowId={(r) => String(r.row)}
            />
          )}
        </section>
      )}
    </div>
  );
}
