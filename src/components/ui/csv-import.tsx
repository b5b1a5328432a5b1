import { useId, useMemo, useState, type ReactNode, type Ref } from 'react';
import { useForm, useWatch, type UseFormRegisterReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { ColumnDef } from '@tanstack/react-table';
import { Download, FileCheck, Upload } from 'lucide-react';
import { z } from 'zod';
import { isApiError } from '@/lib/api/client';
import { Alert } from './alert';
import { Badge } from './badge';
import { Button } from './button';
import { DataTable } from './data-table';
import { inputClasses, TextAreaField } from './field';

// The server takes at most 2,000,000 characters; a bigger file is refused here at once.
const MAX_FILE_BYTES = 2_000_000;
const FormSchema = z.object({
  csv: z.string().min(1, 'Choose a file or paste the rows').max(MAX_FILE_BYTES, 'The file is larger than 2 MB'),
});

export interface CsvProblem {
  row: number;
  field: string;
  message: string;
}

export interface CsvCheckResult<Row extends { row: number }> {
  rows: Row[];
  errors: CsvProblem[];
}

export type PreviewRow<Row> = Row & { problems: number };

/** "Row 4, email: Enter a valid e-mail address", or "Row 1: The file has no header line". */
export function csvProblemText(p: CsvProblem): string {
  // Row 0 is the server's closing count of problems it did not list.
  if (p.row === 0) return p.message;
  return p.field ? `Row ${p.row}, ${p.field}: ${p.message}` : `Row ${p.row}: ${p.message}`;
}

const FIELD_KEY = /^row (\d+)(?:\.(.+))?$/;

/**
 * The row problems of a refused commit (400 with fields keyed "row 4.email" or "row 1"), for when
 * something changed between the check and the import; null when the error is of another kind.
 */
export function csvProblemsOf(error: unknown): CsvProblem[] | null {
  if (!isApiError(error, 400) || !error.fields) return null;
  const problems: CsvProblem[] = [];
  for (const [key, message] of Object.entries(error.fields)) {
    const match = FIELD_KEY.exec(key);
    if (!match) return null;
    problems.push({ row: Number(match[1]), field: match[2] ?? '', message });
  }
  return problems.sort((a, b) => a.row - b.row);
}

/** A "Row" column: the line number in the file, which the preview is sorted by. */
export function rowColumn<Row extends { row: number }>(): ColumnDef<PreviewRow<Row>> {
  return { id: 'row', header: 'Row', accessorFn: (r) => r.row, enableGlobalFilter: false };
}

/** A column showing a main line with a smaller second line under it (a name and its e-mail, say). */
export function twoLineColumn<Row>(opts: {
  id: string;
  header: string;
  main: (row: Row) => string;
  sub: (row: Row) => string;
}): ColumnDef<PreviewRow<Row>> {
  return {
    id: opts.id,
    header: opts.header,
    accessorFn: (r) => `${opts.main(r)} ${opts.sub(r)}`,
    cell: ({ row }) => (
      <div>
        <span className="block font-medium">{opts.main(row.original)}</span>
        <span className="block text-sm break-all text-stone">{opts.sub(row.original)}</span>
      </div>
    ),
  };
}

/** A "Check" column: how many problems a row has, or that it is ready. */
export function checkColumn<Row>(): ColumnDef<PreviewRow<Row>> {
  return {
    id: 'check',
    header: 'Check',
    accessorFn: (r) => (r.problems > 0 ? 'Needs fixing' : 'Ready'),
    cell: ({ row }) =>
      row.original.problems > 0 ? (
        <Badge tone="straw">{row.original.problems === 1 ? '1 problem' : `${row.original.problems} problems`}</Badge>
      ) : (
        <Badge tone="leaf">Ready</Badge>
      ),
  };
}

/** Reads a picked CSV file into the form (refusing one over 2 MB) and remembers its name for the hint. */
export function useCsvFile(onText: (text: string) => void) {
  const [fileName, setFileName] = useState<string | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const pick = async (file: File | undefined) => {
    setFileError(null);
    if (!file) return;
    if (file.size > MAX_FILE_BYTES) {
      setFileError('The file is larger than 2 MB; split it into smaller files.');
      return;
    }
    setFileName(file.name);
    onText(await file.text());
  };
  return { fileName, fileError, pick, forget: () => setFileName(null) };
}

export interface CsvFileFieldProps {
  fileName: string | null;
  error: string | null;
  onPick: (file: File | undefined) => void;
  /** Offers a file with the right header line, when the import has one. */
  templateUrl?: string;
  inputRef?: Ref<HTMLInputElement>;
}

/** The "CSV file" picker, with its error or a hint that the rows can be pasted instead. */
export function CsvFileField({ fileName, error, onPick, templateUrl, inputRef }: CsvFileFieldProps) {
  const fileId = `${useId()}-file`;
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={fileId} className="font-medium text-soil">
        CSV file
      </label>
      <input
        ref={inputRef}
        id={fileId}
        type="file"
        accept=".csv,text/csv"
        aria-describedby={error ? `${fileId}-error` : `${fileId}-hint`}
        aria-invalid={error ? true : undefined}
        className={`${inputClasses} cursor-pointer file:mr-3 file:rounded-md file:border-0 file:bg-paper-100 file:px-3 file:py-1 file:font-medium file:text-soil`}
        onChange={(event) => onPick(event.target.files?.[0])}
      />
      {error ? (
        <p id={`${fileId}-error`} className="text-sm font-medium text-clay-700">
          {error}
        </p>
      ) : (
        <p id={`${fileId}-hint`} className="text-sm text-stone">
          {fileName ? `Loaded ${fileName} into the box below.` : 'Or paste the rows into the box below.'}
          {templateUrl && (
            <>
              {' '}
              <a href={templateUrl} download className="inline-flex items-center gap-1 underline">
                <Download className="size-4" aria-hidden="true" />
                Download a template
              </a>
            </>
          )}
        </p>
      )}
    </div>
  );
}

export interface CsvRowsFieldProps {
  label: string;
  /** The columns the file may have. */
  hint: ReactNode;
  error?: string;
  rows: number;
  /** register('csv') of the form. */
  registration: UseFormRegisterReturn;
}

/** The text box holding the CSV rows, picked or pasted. */
export function CsvRowsField({ label, hint, error, rows, registration }: CsvRowsFieldProps) {
  return (
    <TextAreaField label={label} hint={hint} error={error} rows={rows} spellCheck={false} wrap="off" textareaClassName="font-mono text-sm" {...registration} />
  );
}

export interface CsvImportActionsProps {
  busy: 'check' | 'commit' | null;
  /** Every row checked and right: importing is allowed. */
  ready: boolean;
  importLabel: string;
  onImport: () => void;
  /** Where the import stands, read out with the import button. */
  note: ReactNode;
}

/** "Check file" (the form's submit) and the import button, with the line saying what happens next. */
export function CsvImportActions({ busy, ready, importLabel, onImport, note }: CsvImportActionsProps) {
  const noteId = `${useId()}-note`;
  return (
    <>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="secondary" loading={busy === 'check'} loadingText="Checking…" disabled={busy !== null}>
          <FileCheck className="size-5" aria-hidden="true" />
          Check file
        </Button>
        <Button
          onClick={onImport}
          loading={busy === 'commit'}
          loadingText="Importing…"
          disabled={!ready || busy !== null}
          aria-describedby={noteId}
        >
          <Upload className="size-5" aria-hidden="true" />
          {importLabel}
        </Button>
      </div>
      <p id={noteId} className="-mt-2 text-sm text-stone" aria-live="polite">
        {note}
      </p>
    </>
  );
}

export interface CsvCheckSectionProps<Row extends { row: number }> {
  result: CsvCheckResult<Row>;
  columns: ColumnDef<PreviewRow<Row>>[];
  /** Title and text of the box shown when every row is right. */
  readyTitle: string;
  readyMessage: ReactNode;
  emptyMessage: string;
}

/** The outcome of a check: every problem by row (or that all is ready) and the rows read from the file. */
export function CsvCheckSection<Row extends { row: number }>({
  result,
  columns,
  readyTitle,
  readyMessage,
  emptyMessage,
}: CsvCheckSectionProps<Row>) {
  const headingId = `${useId()}-preview`;
  const rows = useMemo(() => {
    const counts = new Map<number, number>();
    for (const e of result.errors) counts.set(e.row, (counts.get(e.row) ?? 0) + 1);
    return result.rows.map((r) => ({ ...r, problems: counts.get(r.row) ?? 0 }));
  }, [result]);
  const badRows = new Set(result.errors.filter((e) => e.row > 0).map((e) => e.row)).size;
  return (
    <section aria-labelledby={headingId} className="flex min-w-0 flex-col gap-4">
      <h3 id={headingId} className="text-lg font-semibold">
        Check result
      </h3>
      {result.errors.length > 0 ? (
        <Alert
          tone="warning"
          title={badRows > 0 ? `${badRows} ${badRows === 1 ? 'row needs' : 'rows need'} fixing` : 'The file needs fixing'}
        >
          <p>Nothing is saved until every row is right. Fix these in the file or in the box above, then check again.</p>
          <ul className="mt-2 list-disc pl-5" aria-label="Problems by row">
            {result.errors.map((e, i) => (
              <li key={`${e.row}-${e.field}-${i}`}>{csvProblemText(e)}</li>
            ))}
          </ul>
        </Alert>
      ) : (
        <Alert tone="info" title={readyTitle}>
          {readyMessage}
        </Alert>
      )}
      {rows.length > 0 && (
        <DataTable
          data={rows}
          columns={columns}
          caption="Rows read from the file"
          filterLabel="Filter rows"
          emptyMessage={emptyMessage}
          initialSorting={[{ id: 'row', desc: false }]}
          pageSizes={[10, 25, 100]}
          getRowId={(r) => String(r.row)}
        />
      )}
    </section>
  );
}

export interface CsvImportProps<Row extends { row: number }, Result extends CsvCheckResult<Row>> {
  /** Names the text box, e.g. "Member rows". */
  textLabel: string;
  /** The columns the file may have, shown under the text box. */
  columnsHint: ReactNode;
  /** "person" / "people" for button and message text. */
  noun: { one: string; many: string };
  templateUrl: string;
  check: (csv: string) => Promise<Result>;
  commit: (csv: string) => Promise<Result>;
  columns: ColumnDef<PreviewRow<Row>>[];
  /** What to say after a successful import. */
  done: (result: Result) => ReactNode;
}

/** Pick or paste a CSV, check it with every problem by row, preview it, and import every row or none. */
export function CsvImport<Row extends { row: number }, Result extends CsvCheckResult<Row>>({
  textLabel,
  columnsHint,
  noun,
  templateUrl,
  check,
  commit,
  columns,
  done,
}: CsvImportProps<Row, Result>) {
  const [checked, setChecked] = useState<{ csv: string; result: Result } | null>(null);
  const [busy, setBusy] = useState<'check' | 'commit' | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [imported, setImported] = useState<Result | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setValue,
    reset,
    formState: { errors },
  } = useForm({ resolver: zodResolver(FormSchema), defaultValues: { csv: '' } });
  const file = useCsvFile((text) => setValue('csv', text, { shouldValidate: true, shouldDirty: true }));
  const csv = useWatch({ control, name: 'csv' });
  // A preview belongs to the exact text it was made from; any edit means checking again.
  const current = checked && checked.csv === csv ? checked : null;
  const result = current?.result;

  const onCheck = handleSubmit(async (values) => {
    setFormError(null);
    setImported(null);
    setBusy('check');
    try {
      setChecked({ csv: values.csv, result: await check(values.csv) });
    } catch (error) {
      setFormError(error instanceof Error ? error.message : 'Checking did not work. Try again.');
    } finally {
      setBusy(null);
    }
  });

  const onImport = handleSubmit(async (values) => {
    setFormError(null);
    setBusy('commit');
    try {
      const done = await commit(values.csv);
      setChecked(null);
      file.forget();
      reset({ csv: '' });
      setImported(done);
    } catch (error) {
      // Something changed after the check (say, the same person applied meanwhile): show the fresh problems.
      const problems = csvProblemsOf(error);
      if (problems && current) setChecked({ ...current, result: { ...current.result, errors: problems } });
      setFormError(error instanceof Error ? error.message : 'Importing did not work. Try again.');
    } finally {
      setBusy(null);
    }
  });

  const ready = result !== undefined && result.errors.length === 0 && result.rows.length > 0;
  const count = (n: number) => `${n} ${n === 1 ? noun.one : noun.many}`;

  return (
    <div className="flex flex-col gap-5">
      {imported && <Alert tone="success">{done(imported)}</Alert>}
      {formError && <Alert tone="error">{formError}</Alert>}

      <form onSubmit={onCheck} noValidate className="flex flex-col gap-5">
        <CsvFileField
          fileName={file.fileName}
          error={file.fileError}
          templateUrl={templateUrl}
          onPick={(picked) => {
            setImported(null);
            void file.pick(picked);
          }}
        />

        <CsvRowsField
          label={textLabel}
          hint={columnsHint}
          error={errors.csv?.message}
          rows={6}
          registration={register('csv', { onChange: () => setImported(null) })}
        />

        <CsvImportActions
          busy={busy}
          ready={ready}
          importLabel={ready ? `Import ${count(result.rows.length)}` : `Import ${noun.many}`}
          onImport={() => void onImport()}
          note={
            busy === 'check'
              ? 'Checking every row…'
              : busy === 'commit'
                ? 'Saving every row…'
                : ready
                  ? 'Every row is right. Importing saves them all at once.'
                  : checked && !current
                    ? 'The rows changed since the check. Check the file again.'
                    : 'Check the file first; importing opens up when every row is right. Nothing is saved until then.'
          }
        />
      </form>

      {result && (
        <CsvCheckSection
          result={result}
          columns={columns}
          readyTitle={`All ${count(result.rows.length)} ready`}
          readyMessage="Nothing is saved yet. Import to add them."
          emptyMessage="The file has no rows."
        />
      )}
    </div>
  );
}
